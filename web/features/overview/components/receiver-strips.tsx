import { Card } from '../../../components/ui/card';
import { cx } from '../../../lib/cx';
import { failsafeText, type ChannelPlan, type PlanReceiver } from '../channel-plan';
import { SinceNote } from '../../provenance/components/since-note';
import type { Provenance } from '../../provenance/since';
import { receiverName, TelemetryBadge } from './channel-grid';

/** Each receiver as its row of output pins, the way it sits in the airframe: what every pin carries. */
export function ReceiverStrips({ plan, provenance }: { plan: ChannelPlan; provenance?: Provenance }) {
  const functionsOf = (ch: number) => plan.rows.find((row) => row.ch === ch)?.functions.map((fn) => fn.function) ?? [];
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      {plan.receivers.map((receiver) => (
        <ReceiverStrip
          key={receiver.id}
          receiver={receiver}
          functionsOf={functionsOf}
          linkChannels={plan.linkChannels}
          provenance={provenance}
        />
      ))}
    </div>
  );
}

function ReceiverStrip({
  receiver,
  functionsOf,
  linkChannels,
  provenance,
}: {
  receiver: PlanReceiver;
  functionsOf: (ch: number) => string[];
  linkChannels: number | null;
  provenance?: Provenance;
}) {
  const highest = Math.max(receiver.outputs ?? 0, ...receiver.map.map((entry) => entry.pin), 0);
  const pins = Array.from({ length: highest }, (_, index) => index + 1);
  return (
    <Card className="px-4 py-3">
      <h3 className="flex flex-wrap items-baseline gap-x-2 text-base font-semibold text-ink-900">
        {receiverName(receiver)}
        <code className="font-mono text-sm font-normal text-ink-500">{receiver.id}</code>
      </h3>
      <p className="mt-1 flex flex-wrap items-center gap-2 text-sm text-ink-700">
        <span className="capitalize">{receiver.role}</span>
        <span aria-hidden="true">·</span>
        <span>{receiver.outputs === null ? 'outputs not given' : `${receiver.outputs} outputs`}</span>
        <TelemetryBadge receiver={receiver} />
      </p>
      <ol className="mt-3 grid grid-cols-2 gap-1.5 sm:grid-cols-4" aria-label={`Pins of ${receiverName(receiver)}`}>
        {pins.map((pin) => {
          const entries = receiver.map.filter((entry) => entry.pin === pin);
          const beyondOutputs = receiver.outputs !== null && pin > receiver.outputs;
          return (
            <li
              key={pin}
              className={cx(
                'min-w-0 rounded-sm border px-1.5 py-1 text-xs',
                entries.length === 0
                  ? 'border-dashed border-ply-300 text-ink-500'
                  : 'border-ply-300 bg-paper text-ink-900',
                beyondOutputs && 'border-danger-700 bg-danger-100',
              )}
            >
              <SinceNote
                provenance={entries.length > 0 ? provenance : undefined}
                path={`receivers[id=${receiver.id}].map[pin=${pin}]`}
                className="block font-medium"
              >
                Pin {pin}
              </SinceNote>
              {entries.length === 0 && <span className="block">free</span>}
              {entries.map((entry, index) => {
                const names = functionsOf(entry.ch);
                return (
                  <span key={index} className="block">
                    <span className="block font-mono">ch {entry.ch}</span>
                    {linkChannels !== null && entry.ch > linkChannels && (
                      <span className="block font-medium text-danger-700">beyond link</span>
                    )}
                    <span className="block truncate" title={names.join(', ')}>
                      {names.length > 0 ? names.join(', ') : 'no function'}
                    </span>
                    <SinceNote
                      provenance={provenance}
                      path={`receivers[id=${receiver.id}].map[pin=${pin}].failsafe`}
                      className="block text-ink-700"
                    >
                      failsafe {failsafeText(entry.failsafe)}
                    </SinceNote>
                  </span>
                );
              })}
              {beyondOutputs && <span className="block font-medium text-danger-700">beyond outputs</span>}
            </li>
          );
        })}
      </ol>
    </Card>
  );
}
