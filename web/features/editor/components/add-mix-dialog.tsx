import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { SelectField } from '../../../components/ui/select-field';
import { entriesAt, entryAt, fieldText, wholeNumber } from '../form-values';

// A new mix moves a channel as soon as it exists, so it is never added blind: the
// pilot picks where it goes from and to, starting from a control nothing uses yet and a
// channel nothing drives yet (a planned channel with no mix, else a free channel the
// link carries). A control is in use when a mix moves with it, or when it switches dual
// rates, a mix on and off or a channel's cut: a mix from the arm switch would move its
// channel whenever the motor is armed. When every control is in use the dialog asks
// instead of proposing one. Picking a channel that already has a mix says so: mixes add up.

export interface NewMix {
  from: string;
  to: number;
}

interface Target {
  ch: number;
  label: string;
  /** Ids of mixes already feeding this channel. */
  fedBy: string[];
}

function targetsOf(data: unknown): Target[] {
  const planned = entriesAt(data, 'channels').flatMap(({ entry }) => {
    const ch = wholeNumber(entry.ch);
    return ch === null ? [] : [{ ch, fn: fieldText(entry.function) }];
  });
  const link = wholeNumber(entryAt(data, 'link')?.channels) ?? 16;
  const highest = Math.max(link, ...planned.map((entry) => entry.ch), 1);
  const mixes = entriesAt(data, 'mixes').map(({ entry }) => entry);
  return Array.from({ length: Math.min(highest, 32) }, (_, i) => i + 1).map((ch) => {
    const fns = planned.filter((entry) => entry.ch === ch).map((entry) => entry.fn);
    return {
      ch,
      label: fns.length > 0 ? `${ch}: ${fns.join(' + ')}` : `${ch}: nothing planned`,
      fedBy: mixes.filter((mix) => wholeNumber(mix.to) === ch).map((mix) => fieldText(mix.id)),
    };
  });
}

/** What each control already does, in a pilot's words: "a mix", "dual rates", "a mix's switch", "the cut". */
function controlUses(data: unknown): Map<string, string[]> {
  const uses = new Map<string, string[]>();
  const note = (control: unknown, use: string) => {
    const id = fieldText(control);
    if (id === '') return;
    const known = uses.get(id) ?? [];
    if (!known.includes(use)) uses.set(id, [...known, use]);
  };
  for (const { entry: mix } of entriesAt(data, 'mixes')) {
    note(mix.from, 'a mix');
    note(entryAt(mix, 'rates')?.control, 'dual rates');
    note(entryAt(mix, 'active')?.control, 'a mix’s switch');
  }
  for (const { entry: channel } of entriesAt(data, 'channels')) note(entryAt(channel, 'cut')?.control, 'the cut');
  return uses;
}

function usesText(uses: readonly string[] | undefined): string {
  if (!uses) return ' (not used yet)';
  const words = uses.length === 1 ? uses[0] : `${uses.slice(0, -1).join(', ')} and ${uses[uses.length - 1]}`;
  return ` (used by ${words})`;
}

export function AddMixDialog({
  data,
  controls,
  onAdd,
  onClose,
}: {
  data: unknown;
  controls: readonly { id: string }[];
  onAdd: (mix: NewMix) => void;
  onClose: () => void;
}) {
  const targets = targetsOf(data);
  const planned = new Set(entriesAt(data, 'channels').map(({ entry }) => wholeNumber(entry.ch)));
  const uses = controlUses(data);
  const firstFree = controls.find((control) => !uses.has(control.id));
  const firstTarget =
    targets.find((target) => target.fedBy.length === 0 && planned.has(target.ch)) ??
    targets.find((target) => target.fedBy.length === 0) ??
    targets[0];
  const [from, setFrom] = useState(firstFree?.id ?? '');
  const [to, setTo] = useState(firstTarget?.ch ?? 1);
  const [fromError, setFromError] = useState<string | undefined>();
  const chosen = targets.find((target) => target.ch === to);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (from === '') setFromError('Choose the control this mix moves with.');
    else onAdd({ from, to });
  };

  return (
    <Dialog
      title="Add a mix"
      description="A mix moves its channel as soon as it is in the setup: check the control and the channel before adding it."
      onClose={onClose}
    >
      {controls.length === 0 ? (
        <p className="text-base text-ink-700">
          The setup has no controls yet. Add the transmitter&apos;s controls first (the Controls and link tab).
        </p>
      ) : (
        <form onSubmit={submit} noValidate className="space-y-4">
          {!firstFree && (
            <p className="text-sm text-ink-700">
              Every control already does something (a mix, dual rates, a mix&apos;s switch or the cut). Choose one
              knowing that this mix will move its channel whenever that control moves.
            </p>
          )}
          <SelectField
            label="From control"
            value={from}
            error={fromError}
            onChange={(event) => {
              setFrom(event.target.value);
              setFromError(undefined);
            }}
            data-autofocus
          >
            {!firstFree && <option value="">Choose a control</option>}
            {controls.map((control) => (
              <option key={control.id} value={control.id}>
                {control.id}
                {usesText(uses.get(control.id))}
              </option>
            ))}
          </SelectField>
          <SelectField label="To channel" value={String(to)} onChange={(event) => setTo(Number(event.target.value))}>
            {targets.map((target) => (
              <option key={target.ch} value={target.ch}>
                {target.label}
                {target.fedBy.length > 0 ? ` (fed by ${target.fedBy.join(', ')})` : ''}
              </option>
            ))}
          </SelectField>
          {chosen && chosen.fedBy.length > 0 && (
            <p role="status" className="rounded-md border border-caution-700/40 bg-caution-100/60 px-3 py-2 text-sm">
              Channel {chosen.ch} is already fed by {chosen.fedBy.join(', ')}. Mixes on one channel add up, so this one
              moves it further.
            </p>
          )}
          <div className="flex flex-wrap justify-end gap-2">
            <Button variant="secondary" onClick={onClose}>
              Cancel
            </Button>
            <Button type="submit">Add the mix</Button>
          </div>
        </form>
      )}
    </Dialog>
  );
}
