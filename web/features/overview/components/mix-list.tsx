import { Card } from '../../../components/ui/card';
import { SinceNote } from '../../provenance/components/since-note';
import type { Provenance } from '../../provenance/since';

interface MixRow {
  id: string;
  from: string;
  to: string;
  weight: string;
  expo: string;
}

const record = (value: unknown): Record<string, unknown> =>
  value && typeof value === 'object' && !Array.isArray(value) ? (value as Record<string, unknown>) : {};
const shown = (value: unknown, fallback: string): string =>
  typeof value === 'number' || typeof value === 'string' ? String(value) : fallback;

/** The mixes a document names, as the list shows them. */
export function mixesOf(document: unknown): MixRow[] {
  const mixes = record(document).mixes;
  if (!Array.isArray(mixes)) return [];
  return mixes.flatMap((item) => {
    const mix = record(item);
    if (typeof mix.id !== 'string') return [];
    return [
      {
        id: mix.id,
        from: shown(mix.from, '—'),
        to: shown(mix.to, '—'),
        weight: `${shown(mix.weight, '100')} %`,
        expo: `${shown(mix.expo, '0')} %`,
      },
    ];
  });
}

/** The setup's mixes, each telling (on hover or focus) which revision last changed it. */
export function MixList({ document, provenance }: { document: unknown; provenance?: Provenance }) {
  const mixes = mixesOf(document);
  return (
    <Card className="overflow-x-auto px-4 py-3">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Mixes: source, target channel, weight and expo</caption>
        <thead className="border-b border-ply-300 text-xs text-ink-700">
          <tr>
            <th scope="col" className="py-1 pr-3 font-medium">
              Mix
            </th>
            <th scope="col" className="py-1 pr-3 font-medium">
              From
            </th>
            <th scope="col" className="py-1 pr-3 font-medium">
              To channel
            </th>
            <th scope="col" className="py-1 pr-3 font-medium">
              Weight
            </th>
            <th scope="col" className="py-1 font-medium">
              Expo
            </th>
          </tr>
        </thead>
        <tbody className="divide-y divide-ply-200">
          {mixes.map((mix) => {
            const path = `mixes[id=${mix.id}]`;
            return (
              <tr key={mix.id}>
                <td className="py-1 pr-3 font-mono">
                  <SinceNote provenance={provenance} path={path}>
                    {mix.id}
                  </SinceNote>
                </td>
                <td className="py-1 pr-3 font-mono">{mix.from}</td>
                <td className="py-1 pr-3 font-mono">{mix.to}</td>
                <td className="py-1 pr-3 font-mono">
                  <SinceNote provenance={provenance} path={`${path}.weight`}>
                    {mix.weight}
                  </SinceNote>
                </td>
                <td className="py-1 font-mono">
                  <SinceNote provenance={provenance} path={`${path}.expo`}>
                    {mix.expo}
                  </SinceNote>
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </Card>
  );
}
