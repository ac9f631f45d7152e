import { useId } from 'react';
import type { ChannelOutput } from '@shared/evaluate/evaluate';
import type { Channel } from '@shared/format/schema';
import { Badge } from '../../../components/ui/badge';
import { Card } from '../../../components/ui/card';
import { BenchHead, BenchRow, BenchTable, Td, Th } from './bench-table';

/** A channel's value on a centred track: where it sits between −100 and +100. */
function ValueBar({ value }: { value: number }) {
  const half = Math.min(100, Math.abs(value)) / 2;
  return (
    <span className="relative block h-2 w-full min-w-16 rounded-full bg-ply-100 max-sm:w-1/2" aria-hidden="true">
      <span className="absolute top-0 left-1/2 h-full w-px bg-ply-500" />
      <span
        className="absolute top-0 h-full rounded-full bg-accent-600"
        style={value >= 0 ? { left: '50%', width: `${half}%` } : { right: '50%', width: `${half}%` }}
      />
    </span>
  );
}

export interface ChannelTableProps {
  outputs: readonly ChannelOutput[];
  plan: readonly Channel[];
  /** Channels whose cut holds them right now. */
  cutOn: ReadonlySet<number>;
}

export function ChannelTable({ outputs, plan, cutOn }: ChannelTableProps) {
  const headingId = useId();
  const roleOf = new Map(plan.map((channel) => [channel.ch, channel]));
  return (
    <Card className="px-4 py-4">
      <section aria-labelledby={headingId}>
        <h2 id={headingId} className="text-lg font-semibold text-ink-900">
          Channels
        </h2>
        {outputs.length === 0 ? (
          <p className="mt-2 text-base text-ink-700">The channel plan is empty: there is nothing to drive.</p>
        ) : (
          <BenchTable caption="Each channel's value and pulse at the controls' positions">
            <BenchHead>
              <tr>
                <Th className="w-12">Ch</Th>
                <Th>Function</Th>
                <Th className="w-1/3">Value</Th>
                <Th numeric className="w-20">
                  %
                </Th>
                <Th numeric className="w-24 whitespace-nowrap">
                  Pulse µs
                </Th>
              </tr>
            </BenchHead>
            <tbody>
              {outputs.map((channel) => {
                const entry = roleOf.get(channel.ch);
                return (
                  <BenchRow key={channel.ch}>
                    <Td label="Channel" className="font-mono">
                      {channel.ch}
                    </Td>
                    <Td label="Function" className="max-sm:items-start">
                      <span className="max-sm:text-right">
                        <span className="whitespace-nowrap text-ink-900">{channel.function}</span>
                        {cutOn.has(channel.ch) && (
                          <Badge tone="caution" className="ml-2">
                            cut on
                          </Badge>
                        )}
                        <span className="block text-xs text-ink-500">
                          {entry?.role}
                          {entry?.side ? `, ${entry.side}` : ''}
                          {entry?.travel.reverse ? ', reversed' : ''}
                        </span>
                      </span>
                    </Td>
                    <Td label="Value">
                      <ValueBar value={channel.value} />
                    </Td>
                    <Td label="%" numeric>
                      {channel.value.toFixed(channel.value % 1 === 0 ? 0 : 1)}
                    </Td>
                    <Td label="Pulse µs" numeric className="font-semibold text-ink-900">
                      {channel.pulse_us}
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
