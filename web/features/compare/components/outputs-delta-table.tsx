import { Fragment } from 'react';
import type { OutputDelta } from '../../../../shared/diff';
import { Card } from '../../../components/ui/card';

function pulseText(value: OutputDelta['before_us'], kind: OutputDelta['kind']): string {
  if (value === null) return kind === 'failsafe' ? 'no pulses (off or receiver default)' : 'no output';
  return `${value} us`;
}

function channelText(delta: OutputDelta): string {
  if (delta.ch_before === delta.ch_after) return delta.ch_after === null ? '—' : String(delta.ch_after);
  return `${delta.ch_before ?? '—'} -> ${delta.ch_after ?? '—'}`;
}

/** "What now moves differently": the pins whose pulse differs at a standard position, or whose failsafe does. */
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
        Every pin outputs the same pulses at every standard position, and fails safe the same way.
      </p>
    );
  }
  const groups = new Map<string, OutputDelta[]>();
  for (const delta of deltas) groups.set(delta.position.label, [...(groups.get(delta.position.label) ?? []), delta]);

  return (
    <Card className="overflow-x-auto">
      <table className="w-full text-left text-base">
        <caption className="sr-only">Receiver pins whose output differs, by control position</caption>
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
                  colSpan={5}
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
                  <td className="px-3 py-2 font-mono text-sm text-ink-700">{pulseText(delta.before_us, delta.kind)}</td>
                  <td className="px-3 py-2 font-mono text-sm font-medium text-ink-900">
                    <span aria-hidden="true" className="mr-1 text-ink-500">
                      -&gt;
                    </span>
                    {pulseText(delta.after_us, delta.kind)}
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
