import { Fragment } from 'react';
import type { OutputDelta } from '@shared/diff';
import { Card } from '../../../components/ui/card';

type Failsafe = OutputDelta['failsafe_before'];

/**
 * What the pin sends on one side, in words. With its receiver lost, a null pulse is
 * either no pulses (`off`) or the receiver's own default (no failsafe set), and a held
 * pulse says that it is held.
 */
function sideText(value: number | null, kind: OutputDelta['kind'], failsafe: Failsafe): string {
  if (kind === 'pulse') return value === null ? 'no output' : `${value} µs`;
  if (failsafe === 'hold') return value === null ? 'held (no pin)' : `${value} µs (held)`;
  if (failsafe === 'off') return 'no pulses';
  if (failsafe === null || failsafe === undefined)
    return value === null ? 'receiver default (not known)' : `${value} µs`;
  return `${value ?? failsafe} µs (failsafe)`;
}

function channelText(delta: OutputDelta): string {
  if (delta.ch_before === delta.ch_after) return delta.ch_after === null ? '—' : String(delta.ch_after);
  return `${delta.ch_before ?? '—'} -> ${delta.ch_after ?? '—'}`;
}

function linkText(delta: OutputDelta): string {
  return delta.position.lost.length === 0 ? 'up' : `${delta.position.lost.join(', ')} lost`;
}

/**
 * "What now moves differently": each pin that sends something else in the newer
 * revision, grouped by the position where it does (controls and link state; a
 * position with a receiver lost names it).
 */
export function OutputsDeltaTable({ deltas }: { deltas: OutputDelta[] | null }) {
  if (deltas === null) {
    return (
      <p className="rounded-lg border border-ply-200 bg-paper-raised px-4 py-3 text-base text-ink-700">
        One of the two revisions has schema errors, so the bench cannot work out its pulses. Fix the errors to see what
        moves differently.
      </p>
    );
  }
  if (deltas.length === 0) {
    return (
      <p className="rounded-lg border border-ply-200 bg-paper-raised px-4 py-3 text-base text-ink-700">
        Every pin sends the same pulse at every position of the controls, with the link up and with each receiver lost.
      </p>
    );
  }
  const groups = new Map<string, OutputDelta[]>();
  for (const delta of deltas) groups.set(delta.position.label, [...(groups.get(delta.position.label) ?? []), delta]);

  return (
    <Card className="overflow-x-auto">
      <table className="w-full text-left text-base">
        <caption className="sr-only">Receiver pins whose output differs, by control position and link state</caption>
        <thead className="border-b border-ply-200 text-sm text-ink-700">
          <tr>
            <th scope="col" className="px-4 py-2 font-medium">
              Receiver
            </th>
            <th scope="col" className="px-3 py-2 font-medium">
              Pin
            </th>
            <th scope="col" className="px-3 py-2 font-medium">
              Channel
            </th>
            <th scope="col" className="px-3 py-2 font-medium">
              Link
            </th>
            <th scope="col" className="px-3 py-2 font-medium">
              Before
            </th>
            <th scope="col" className="px-3 py-2 font-medium">
              After
            </th>
          </tr>
        </thead>
        <tbody>
          {[...groups.entries()].map(([label, rows]) => (
            <Fragment key={label}>
              <tr className="bg-paper">
                <th
                  scope="colgroup"
                  colSpan={6}
                  className="border-y border-ply-200 px-4 py-1.5 text-sm font-semibold text-ink-900"
                >
                  {label}
                </th>
              </tr>
              {rows.map((delta) => (
                <tr
                  key={`${delta.kind}-${delta.receiver}-${delta.pin}`}
                  className="border-b border-ply-100"
                  title={delta.summary}
                >
                  <td className="px-4 py-2 font-mono text-sm">{delta.receiver}</td>
                  <td className="px-3 py-2 font-mono text-sm">{delta.pin}</td>
                  <td className="px-3 py-2 font-mono text-sm">{channelText(delta)}</td>
                  <td className="px-3 py-2 text-sm">{linkText(delta)}</td>
                  <td className="px-3 py-2 font-mono text-sm text-ink-700">
                    {sideText(delta.before_us, delta.kind, delta.failsafe_before)}
                  </td>
                  <td className="px-3 py-2 font-mono text-sm font-medium text-ink-900">
                    <span aria-hidden="true" className="mr-1 text-ink-500">
                      -&gt;
                    </span>
                    {sideText(delta.after_us, delta.kind, delta.failsafe_after)}
                  </td>
                </tr>
              ))}
            </Fragment>
          ))}
        </tbody>
      </table>
    </Card>
  );
}
