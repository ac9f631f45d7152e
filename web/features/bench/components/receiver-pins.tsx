import { useId } from 'react';
import type { ReceiverOutput } from '../../../../shared/evaluate/evaluate';
import type { Receiver } from '../../../../shared/format/schema';
import { Badge } from '../../../components/ui/badge';
import { Card } from '../../../components/ui/card';
import { cx } from '../../../lib/cx';
import { failsafeWords, pulseOnLinkLoss } from '../failsafe-words';
import { BenchTable, Td, Th } from './bench-table';

export interface ReceiverPinsProps {
  receiver: Receiver;
  output: ReceiverOutput;
  /** The function each channel carries, from the channel plan. */
  functions: ReadonlyMap<number, string>;
  linkLost: boolean;
}

export function ReceiverPins({ receiver, output, functions, linkLost }: ReceiverPinsProps) {
  const headingId = useId();
  const title = receiver.label ?? receiver.id;
  return (
    <Card className={cx('px-4 py-4', linkLost && 'border-caution-700/50')}>
      <section aria-labelledby={headingId}>
        <div className="flex flex-wrap items-baseline justify-between gap-x-3 gap-y-1">
          <h3 id={headingId} className="text-lg font-semibold text-ink-900">
            {title}
          </h3>
          <p className="flex flex-wrap items-center gap-1.5 text-xs text-ink-700">
            <code className="font-mono">{receiver.id}</code>
            <Badge>{receiver.role}</Badge>
            <span>{receiver.outputs} outputs</span>
          </p>
        </div>
        {output.pins.length === 0 ? (
          <p className="mt-2 text-base text-ink-700">No pin of this receiver is mapped to a channel.</p>
        ) : (
          <BenchTable
            caption={`Pins of ${title}: channel, pulse ${linkLost ? 'with the link lost' : 'now'} and failsafe`}
          >
            <thead>
              <tr>
                <Th className="w-12">Pin</Th>
                <Th className="w-12">Ch</Th>
                <Th>Function</Th>
                <Th numeric className="w-28 whitespace-nowrap">
                  {linkLost ? 'Link lost us' : 'Pulse us'}
                </Th>
                <Th>Failsafe</Th>
              </tr>
            </thead>
            <tbody>
              {output.pins.map((pin) => {
                const lost = pulseOnLinkLoss(pin);
                return (
                  <tr key={pin.pin} className={cx(linkLost && 'bg-caution-100/40')}>
                    <Td className="font-mono">{pin.pin}</Td>
                    <Td className="font-mono">{pin.ch}</Td>
                    <Td className="whitespace-nowrap">
                      {functions.get(pin.ch) ?? <span className="text-ink-500">not planned</span>}
                    </Td>
                    <Td numeric className="font-semibold text-ink-900">
                      {linkLost ? (
                        <>
                          {lost.pulse ?? <span className="font-sans font-normal text-ink-700">{lost.note}</span>}
                          {lost.pulse !== null && lost.note && (
                            <span className="ml-1 font-sans text-xs font-normal text-ink-700">({lost.note})</span>
                          )}
                        </>
                      ) : (
                        pin.pulse_us
                      )}
                    </Td>
                    <Td className={pin.failsafe === null ? 'text-caution-700' : 'text-ink-700'}>
                      {failsafeWords(pin.failsafe)}
                    </Td>
                  </tr>
                );
              })}
            </tbody>
          </BenchTable>
        )}
      </section>
    </Card>
  );
}
