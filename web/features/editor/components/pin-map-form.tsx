import { useId, useState } from 'react';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { FieldError } from '../../../components/ui/field-error';
import type { DocumentEdit } from '@shared/edit/document-edits';
import {
  entriesAt,
  fieldText,
  parseWhole,
  wholeNumber,
  type Entry,
  type FormProps,
  type Indexed,
} from '../form-values';
import { shiftPinChannels } from '../pin-shift';
import { FailsafeField } from './failsafe-field';
import { Cell, FormTable, HeaderCell } from './form-table';
import { NumberField } from './number-field';

const HIGHEST = 32;

/** Every receiver's pin map, one board each. */
export function PinMapForms({ data, readOnly, onEdits }: FormProps) {
  const receivers = entriesAt(data, 'receivers');
  const functions = new Map<number, string[]>();
  for (const { entry } of entriesAt(data, 'channels')) {
    const ch = wholeNumber(entry.ch);
    if (ch !== null) functions.set(ch, [...(functions.get(ch) ?? []), fieldText(entry.function)]);
  }
  if (receivers.length === 0) {
    return <EmptyState title="No receivers yet">Add a receiver in the text: its id, outputs and map.</EmptyState>;
  }
  return (
    <fieldset disabled={readOnly} className="min-w-0 space-y-5">
      <legend className="sr-only">Pin maps</legend>
      <p className="text-sm text-ink-700">
        Which output pin carries which channel, and what it does when the link is lost.
        {readOnly ? '' : ' Changes here edit the same document.'}
      </p>
      {receivers.map(({ index, entry }) => (
        <ReceiverPinMap
          key={index}
          receiverIndex={index}
          receiver={entry}
          functions={functions}
          readOnly={readOnly}
          onEdits={onEdits}
        />
      ))}
    </fieldset>
  );
}

interface ReceiverPinMapProps {
  receiverIndex: number;
  receiver: Entry;
  functions: ReadonlyMap<number, string[]>;
  readOnly: boolean;
  onEdits: (edits: DocumentEdit[]) => void;
}

function ReceiverPinMap({ receiverIndex, receiver, functions, readOnly, onEdits }: ReceiverPinMapProps) {
  const headingId = useId();
  const shiftId = useId();
  const pins = entriesAt(receiver, 'map');
  const [selected, setSelected] = useState<ReadonlySet<number>>(new Set());
  const [by, setBy] = useState('8');
  const [shiftError, setShiftError] = useState<string | null>(null);
  const [shiftDone, setShiftDone] = useState<string | null>(null);

  const id = fieldText(receiver.id) || `receiver ${receiverIndex + 1}`;
  const title = fieldText(receiver.label) || id;
  const chosen: Indexed[] = pins.filter(({ index }) => selected.has(index));
  const allChosen = pins.length > 0 && chosen.length === pins.length;
  const mapPath = ['receivers', receiverIndex, 'map'] as const;

  const toggle = (index: number, on: boolean) => {
    setSelected((current) => {
      const next = new Set(current);
      if (on) next.add(index);
      else next.delete(index);
      return next;
    });
    setShiftDone(null);
  };

  const shift = () => {
    const amount = parseWhole(by.trim(), -31, 31, 'The shift');
    if (amount.error !== undefined) {
      setShiftError(amount.error);
      return;
    }
    const result = shiftPinChannels(receiverIndex, chosen, amount.value);
    if (result.error !== undefined) {
      setShiftError(result.error);
      return;
    }
    setShiftError(null);
    onEdits(result.edits);
    setShiftDone(result.summary);
  };

  const addPin = () => {
    const usedPins = pins.map(({ entry }) => wholeNumber(entry.pin) ?? 0);
    const usedChannels = pins.map(({ entry }) => wholeNumber(entry.ch) ?? 0);
    const pin = Math.min(HIGHEST, Math.max(0, ...usedPins) + 1);
    const ch = Math.min(HIGHEST, Math.max(0, ...usedChannels) + 1);
    onEdits([{ kind: 'append', path: [...mapPath], value: { pin, ch } }]);
  };

  return (
    <Card className="px-4 py-4 sm:px-5">
      <section aria-labelledby={headingId}>
        <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
          <h3 id={headingId} className="text-lg font-semibold text-ink-900">
            {title}
          </h3>
          <p className="flex flex-wrap items-center gap-2 text-sm text-ink-700">
            {title !== id && <code className="font-mono">{id}</code>}
            <Badge>{fieldText(receiver.role) || 'primary'}</Badge>
            <span>{fieldText(receiver.outputs) || '?'} outputs</span>
            <span>telemetry {receiver.telemetry === false ? 'off' : 'on'}</span>
          </p>
        </div>

        {pins.length === 0 ? (
          <p className="mt-3 text-base text-ink-700">This receiver has no pins mapped yet.</p>
        ) : (
          <>
            {!readOnly && (
              <div className="mt-3 flex flex-wrap items-end gap-2 rounded-md bg-paper px-3 py-2.5">
                <div>
                  <label htmlFor={shiftId} className="block text-sm font-medium text-ink-900">
                    Shift these pins’ channels by
                  </label>
                  <input
                    id={shiftId}
                    inputMode="numeric"
                    value={by}
                    onChange={(event) => {
                      setBy(event.target.value);
                      setShiftError(null);
                    }}
                    className="mt-1 block h-8 w-20 rounded-md border border-ply-500 bg-paper-raised px-2 text-sm"
                  />
                </div>
                <Button size="sm" variant="secondary" disabled={chosen.length === 0} onClick={shift}>
                  Shift{' '}
                  {chosen.length === 0 ? 'selected pins' : chosen.length === 1 ? '1 pin' : `${chosen.length} pins`}
                </Button>
                <p className="pb-1 text-sm text-ink-700">
                  {chosen.length === 0 ? 'Tick the pins to move, like pins 1-8 of a second receiver.' : ''}
                </p>
                <div className="w-full" aria-live="polite">
                  {shiftError && <FieldError id={`${shiftId}-error`}>{shiftError}</FieldError>}
                  {shiftDone && <p className="text-sm text-moss-700">{shiftDone}</p>}
                </div>
              </div>
            )}
            <FormTable caption={`Pin map of ${title}`} className="mt-3">
              <thead>
                <tr>
                  {!readOnly && (
                    <HeaderCell className="w-10">
                      <input
                        type="checkbox"
                        aria-label={`Select every pin of ${title}`}
                        checked={allChosen}
                        onChange={(event) => {
                          setSelected(event.target.checked ? new Set(pins.map(({ index }) => index)) : new Set());
                          setShiftDone(null);
                        }}
                        className="h-4 w-4 accent-accent-700"
                      />
                    </HeaderCell>
                  )}
                  <HeaderCell className="w-20">Pin</HeaderCell>
                  <HeaderCell className="w-20">Channel</HeaderCell>
                  <HeaderCell>Function</HeaderCell>
                  <HeaderCell className="w-72">Failsafe</HeaderCell>
                  {!readOnly && (
                    <HeaderCell className="w-24">
                      <span className="sr-only">Actions</span>
                    </HeaderCell>
                  )}
                </tr>
              </thead>
              <tbody>
                {pins.map(({ index, entry }) => {
                  const pinText = fieldText(entry.pin);
                  const name = `pin ${pinText || index + 1} of ${id}`;
                  const ch = wholeNumber(entry.ch);
                  const carried = ch === null ? undefined : functions.get(ch);
                  return (
                    <tr key={index} className={selected.has(index) ? 'bg-accent-50' : undefined}>
                      {!readOnly && (
                        <Cell>
                          <input
                            type="checkbox"
                            aria-label={`Select ${name}`}
                            checked={selected.has(index)}
                            onChange={(event) => toggle(index, event.target.checked)}
                            className="mt-2 h-4 w-4 accent-accent-700"
                          />
                        </Cell>
                      )}
                      <Cell>
                        <NumberField
                          label={`Pin number of ${name}`}
                          value={entry.pin}
                          path={[...mapPath, index, 'pin']}
                          min={1}
                          max={HIGHEST}
                          what="A pin"
                          onEdits={onEdits}
                        />
                      </Cell>
                      <Cell>
                        <NumberField
                          label={`Channel of ${name}`}
                          value={entry.ch}
                          path={[...mapPath, index, 'ch']}
                          min={1}
                          max={HIGHEST}
                          what="A channel"
                          onEdits={onEdits}
                        />
                      </Cell>
                      <Cell className="pt-3 text-ink-700">
                        {carried ? carried.join(', ') : <span className="text-ink-500">not in the channel plan</span>}
                      </Cell>
                      <Cell>
                        <FailsafeField
                          name={name}
                          value={entry.failsafe}
                          onChange={(value) =>
                            onEdits([
                              value === undefined
                                ? { kind: 'delete', path: [...mapPath, index, 'failsafe'] }
                                : { kind: 'set', path: [...mapPath, index, 'failsafe'], value },
                            ])
                          }
                        />
                      </Cell>
                      {!readOnly && (
                        <Cell className="text-right">
                          <Button
                            variant="quiet"
                            size="sm"
                            aria-label={`Remove ${name}`}
                            onClick={() => {
                              setSelected(new Set());
                              onEdits([{ kind: 'delete', path: [...mapPath, index] }]);
                            }}
                          >
                            Remove
                          </Button>
                        </Cell>
                      )}
                    </tr>
                  );
                })}
              </tbody>
            </FormTable>
          </>
        )}
        {!readOnly && (
          <Button variant="secondary" size="sm" className="mt-3" onClick={addPin}>
            Add a pin
          </Button>
        )}
      </section>
    </Card>
  );
}
