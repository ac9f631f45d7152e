import { Link } from 'react-router-dom';
import { Card } from '../../../components/ui/card';
import type { ShelfUnit } from '../types';
import { MarkLabel } from './mark-label';
import { ReadinessBadge } from './readiness-badge';
import { TelemetryWord } from './telemetry-word';

export function ShelfTable({ units, workspaceId }: { units: ShelfUnit[]; workspaceId: string }) {
  return (
    <Card className="overflow-x-auto">
      <table className="w-full text-left text-base">
        <caption className="sr-only">Receivers on this workspace’s shelf</caption>
        <thead className="border-b border-ply-200 text-sm text-ink-700">
          <tr>
            <th scope="col" className="px-3 py-2.5 font-medium">
              Receiver
            </th>
            <th scope="col" className="px-3 py-2.5 font-medium">
              Mark
            </th>
            <th scope="col" className="px-3 py-2.5 font-medium">
              Code
            </th>
            <th scope="col" className="px-3 py-2.5 text-right font-medium">
              Outputs
            </th>
            <th scope="col" className="px-3 py-2.5 font-medium">
              Where installed
            </th>
            <th scope="col" className="px-3 py-2.5 font-medium">
              Telemetry
            </th>
          </tr>
        </thead>
        <tbody className="divide-y divide-ply-100">
          {units.map((unit) => (
            <tr key={unit.id} className="align-top hover:bg-paper">
              <td className="px-3 py-3">
                <Link to={`/w/${workspaceId}/shelf/${unit.id}`} className="font-medium">
                  {unit.label}
                </Link>
                {unit.notes && (
                  <span className="mt-0.5 block max-w-[12rem] truncate text-sm text-ink-500 lg:max-w-xs">
                    {unit.notes}
                  </span>
                )}
              </td>
              <td className="min-w-[9.5rem] px-3 py-3 text-ink-900">
                <MarkLabel mark={unit.mark} colour={unit.mark_colour} />
              </td>
              <td className="px-3 py-3 font-mono text-sm whitespace-nowrap">{unit.short_code}</td>
              <td className="px-3 py-3 text-right font-mono text-sm">{unit.outputs}</td>
              <td className="min-w-[11rem] px-3 py-3">
                {unit.installed ? (
                  <div className="flex flex-col items-start gap-1">
                    <span>
                      <Link to={`/models/${unit.installed.model.id}/overview`}>
                        {unit.installed.model.name ?? 'A model'}
                      </Link>
                      <span className="text-ink-700">
                        {' '}
                        · slot <code className="font-mono text-sm">{unit.installed.slot}</code>
                      </span>
                    </span>
                    {unit.readiness && <ReadinessBadge readiness={unit.readiness} />}
                  </div>
                ) : (
                  <span className="text-ink-700">Free, on the shelf</span>
                )}
              </td>
              <td className="px-3 py-3">
                <TelemetryWord telemetry={unit.telemetry} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </Card>
  );
}
