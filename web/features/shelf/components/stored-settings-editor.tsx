import { useState, type FormEvent } from 'react';
import type { StoredFailsafe, StoredSettings } from '@shared/reuse/stored-settings';
import { Button } from '../../../components/ui/button';
import { FormAlert } from '../../../components/ui/form-alert';
import { isApiError } from '../../../lib/api-client';
import { useUpdateReceiver } from '../api/change-receiver';

interface Row {
  ch: string;
  failsafe: string;
}

function rowOf(entry: { ch: number; failsafe: StoredFailsafe } | undefined): Row {
  if (!entry) return { ch: '', failsafe: '' };
  return { ch: String(entry.ch), failsafe: entry.failsafe === null ? '' : String(entry.failsafe) };
}

/** Which choice of the failsafe list a typed value stands for; anything but the words is a pulse. */
const failsafeMode = (text: string): 'pulse' | 'hold' | 'off' | '' =>
  text === '' || text === 'hold' || text === 'off' ? text : 'pulse';

/** The failsafe as the format stores it; any other text as typed, for the server to refuse with its reason. */
function failsafeOf(text: string): number | string | null {
  const value = text.trim().toLowerCase();
  if (value === '') return null;
  if (value === 'hold' || value === 'off') return value;
  return /^\d+$/.test(value) ? Number(value) : text;
}

/** Record what the unit holds now, read off the unit itself: a channel and a failsafe per pin, and telemetry. */
export function StoredSettingsEditor({
  receiverId,
  outputs,
  settings,
  onDone,
}: {
  receiverId: string;
  outputs: number;
  settings: StoredSettings | null;
  onDone: () => void;
}) {
  const update = useUpdateReceiver(receiverId);
  const byPin = new Map((settings?.pins ?? []).map((entry) => [entry.pin, entry]));
  const [telemetry, setTelemetry] = useState(settings?.telemetry ?? true);
  const [rows, setRows] = useState<Row[]>(() =>
    Array.from({ length: outputs }, (_, index) => rowOf(byPin.get(index + 1))),
  );
  const fields = isApiError(update.error) ? update.error.fields : {};

  const set = (index: number, change: Partial<Row>) =>
    setRows((all) => all.map((row, i) => (i === index ? { ...row, ...change } : row)));

  function submit(event: FormEvent) {
    event.preventDefault();
    const pins = rows.flatMap((row, index) =>
      row.ch.trim() === '' ? [] : [{ pin: index + 1, ch: Number(row.ch), failsafe: failsafeOf(row.failsafe) }],
    );
    update.mutate({ stored_settings: { telemetry, pins: pins as StoredSettings['pins'] } }, { onSuccess: onDone });
  }

  return (
    <form onSubmit={submit} noValidate className="space-y-3">
      {update.error && <FormAlert>{update.error.message}</FormAlert>}
      <label className="flex items-center gap-2 text-base text-ink-900">
        <input
          type="checkbox"
          checked={telemetry}
          onChange={(event) => setTelemetry(event.target.checked)}
          className="h-4 w-4 accent-accent-700"
        />
        The unit sends telemetry
      </label>
      <div className="overflow-x-auto rounded-lg border border-ply-200 bg-paper-raised">
        <table className="w-full text-left text-base">
          <caption className="sr-only">
            Settings per output pin; leave the channel empty for a pin that carries none
          </caption>
          <thead className="border-b border-ply-200 text-sm text-ink-700">
            <tr>
              <th scope="col" className="px-3 py-2 font-medium">
                Pin
              </th>
              <th scope="col" className="px-3 py-2 font-medium">
                Channel
              </th>
              <th scope="col" className="px-3 py-2 font-medium">
                Failsafe
              </th>
            </tr>
          </thead>
          <tbody className="divide-y divide-ply-100">
            {rows.map((row, index) => {
              const pin = index + 1;
              const chError = fields[`stored_settings.pins.${index}.ch`];
              const failsafeError = fields[`stored_settings.pins.${index}.failsafe`];
              return (
                <tr key={pin}>
                  <th scope="row" className="px-3 py-1.5 font-mono text-sm font-normal">
                    {pin}
                  </th>
                  <td className="px-3 py-1.5">
                    <input
                      aria-label={`Channel of pin ${pin}`}
                      inputMode="numeric"
                      value={row.ch}
                      onChange={(event) => set(index, { ch: event.target.value })}
                      aria-invalid={chError ? true : undefined}
                      className="h-9 w-20 rounded-md border border-ply-500 bg-paper-raised px-2 font-mono text-sm"
                    />
                    {chError && <p className="text-sm text-danger-700">{chError}</p>}
                  </td>
                  <td className="px-3 py-1.5">
                    <div className="flex flex-wrap items-center gap-1.5">
                      <select
                        aria-label={`Failsafe of pin ${pin}`}
                        value={failsafeMode(row.failsafe)}
                        onChange={(event) =>
                          set(index, { failsafe: event.target.value === 'pulse' ? '1500' : event.target.value })
                        }
                        aria-invalid={failsafeError ? true : undefined}
                        className="h-9 w-44 rounded-md border border-ply-500 bg-paper-raised px-2 text-sm"
                      >
                        <option value="pulse">Pulse (µs)</option>
                        <option value="hold">Hold last pulse</option>
                        <option value="off">Off (no pulses)</option>
                        <option value="">Not set (the receiver&apos;s own default)</option>
                      </select>
                      {failsafeMode(row.failsafe) === 'pulse' && (
                        <input
                          aria-label={`Failsafe pulse of pin ${pin} in microseconds`}
                          inputMode="numeric"
                          value={row.failsafe}
                          onChange={(event) => set(index, { failsafe: event.target.value })}
                          aria-invalid={failsafeError ? true : undefined}
                          className="h-9 w-20 rounded-md border border-ply-500 bg-paper-raised px-2 font-mono text-sm"
                        />
                      )}
                    </div>
                    {failsafeError && <p className="text-sm text-danger-700">{failsafeError}</p>}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <div className="flex justify-end gap-2">
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
        <Button type="submit" pending={update.isPending}>
          Record these settings
        </Button>
      </div>
    </form>
  );
}
