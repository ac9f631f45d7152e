import { useId } from 'react';
import type { ReceiverOutput } from '@shared/evaluate/evaluate';
import type { Receiver } from '@shared/format/schema';
import { Badge } from '../../../components/ui/badge';
import { Card } from '../../../components/ui/card';
import { cx } from '../../../lib/cx';
import { failsafeWords, pinState } from '../failsafe-words';
import { BenchHead, BenchRow, BenchTable, Td, Th } from './bench-table';

export interface ReceiverPinsProps {
  receiver: Receiver;
  output: ReceiverOutput;
  /** The function each channel carries, from the channel plan. */
  functions: ReadonlyMap<number, string>;
}

/** One receiver's pins: channel, the pulse it sends now, its state in words, and its failsafe. */
export function ReceiverPins({ receiver, output, functions }: ReceiverPinsProps) {
  const headingId = useId();
  const title = receiver.label ?? receiver.id;
  const lost = output.lost;
  return (
    <Card className={cx('px-4 py-4', lost && 'border-caution-700/50')}>
      <section aria-labelledby={headingId}>
        <div className="flex flex-wrap items-baseline justify-between gap-x-3 gap-y-1">
          <h3 id={headingId} className="text-lg font-semibold text-ink-900">
            {title}
          </h3>
          <p className="flex flex-wrap items-center gap-1.5 text-xs text-ink-700">
            <code className="font-mono">{receiver.id}</code>
            <Badge>{receiver.role}</Badge>
            <span>{receiver.outputs} outputs</span>
            {lost ? <Badge tone="caution">link lost</Badge> : <span>link up</span>}
          </p>
        </div>
        {output.pins.length === 0 ? (
          <p className="mt-2 text-base text-ink-700">No pin of this receiver is mapped to a channel.</p>
        ) : (
          <BenchTable
            caption={`Pins of ${title}: channel, pulse ${lost ? 'with the link lost' : 'now'}, state and failsafe`}
          >
            <BenchHead>
              <tr>
                <Th className="w-12">Pin</Th>
                <Th className="w-12">Ch</Th>
                <Th>Function</Th>
                <Th numeric className="w-24 whitespace-nowrap">
                  Pulse µs
                </Th>
                <Th>State</Th>
                <Th>Failsafe</Th>
              </tr>
            </BenchHead>
            <tbody>
              {output.pins.map((pin) => {
                const state = pinState(pin, lost);
                return (
                  <BenchRow key={pin.pin} className={cx(lost && 'bg-caution-100/40')}>
                    <Td label="Pin" className="font-mono">
                      {pin.pin}
                    </Td>
                    <Td label="Channel" className="font-mono">
                      {pin.ch}
                    </Td>
                    <Td label="Function" className="whitespace-nowrap">
                      {functions.get(pin.ch) ?? <span className="text-ink-500">not planned</span>}
                    </Td>
                    <Td label="Pulse µs" numeric className="font-semibold text-ink-900">
                      {pin.pulse_us ?? <span className="font-sans font-normal text-ink-700">none</span>}
                    </Td>
                    <Td
                      label="State"
                      className={cx(
                        'whitespace-nowrap',
                        state.kind === 'live' ? 'text-ink-700' : 'font-medium text-ink-900',
                        state.kind === 'receiver-default' && 'text-caution-700',
                      )}
                    >
                      {state.words}
                    </Td>
                    <Td label="Failsafe" className={pin.failsafe === null ? 'text-caution-700' : 'text-ink-700'}>
                      {failsafeWords(pin.failsafe)}
                    </Td>
                  </BenchRow>
                );
              })}
            </tbody>
          </BenchTable>
        )}
      </section>
    </Card>
  );
}
