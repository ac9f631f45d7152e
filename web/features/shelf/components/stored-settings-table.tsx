import { describeFailsafe, type StoredSettings } from '@shared/reuse/stored-settings';
import { exactTime } from '../../models/format-time';

/** What the unit itself holds, pin by pin, as last recorded. */
export function StoredSettingsTable({
  settings,
  outputs,
  recordedAt,
}: {
  settings: StoredSettings | null;
  outputs: number;
  recordedAt: string | null;
}) {
  if (!settings) {
    return (
      <p className="rounded-md border border-dashed border-ply-300 bg-paper px-4 py-3 text-base text-ink-700">
        Not recorded yet. Install the unit into a model as one of its receivers and apply that receiver’s settings, or
        record what it holds now.
      </p>
    );
  }
  const byPin = new Map(settings.pins.map((entry) => [entry.pin, entry]));
  const pins = Array.from({ length: outputs }, (_, index) => index + 1);
  return (
    <div>
      <p className="mb-2 text-base text-ink-900">
        Telemetry: <strong className="font-semibold">{settings.telemetry ? 'sends' : 'off'}</strong>
        {recordedAt && (
          <span className="text-sm text-ink-700">
            {' '}
            · recorded <time dateTime={recordedAt}>{exactTime(recordedAt)}</time>
          </span>
        )}
      </p>
      <div className="overflow-x-auto rounded-lg border border-ply-200 bg-paper-raised">
        <table className="w-full text-left text-base">
          <caption className="sr-only">Stored settings per output pin</caption>
          <thead className="border-b border-ply-200 text-sm text-ink-700">
            <tr>
              <th scope="col" className="px-3 py-2 font-medium">
                Pin
              </th>
              <th scope="col" className="px-3 py-2 font-medium">
                Carries channel
              </th>
              <th scope="col" className="px-3 py-2 font-medium">
                Failsafe
              </th>
            </tr>
          </thead>
          <tbody className="divide-y divide-ply-100 font-mono text-sm">
            {pins.map((pin) => {
              const entry = byPin.get(pin);
              return (
                <tr key={pin}>
                  <td className="px-3 py-1.5">{pin}</td>
                  <td className="px-3 py-1.5">
                    {entry ? entry.ch : <span className="font-sans text-ink-500">none</span>}
                  </td>
                  <td className="px-3 py-1.5">
                    {entry ? describeFailsafe(entry.failsafe) : <span className="font-sans text-ink-500">—</span>}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
    </div>
  );
}
