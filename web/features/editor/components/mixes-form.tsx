import { useState } from 'react';
import { SLUG_PATTERN } from '@shared/format/schema';
import { Button } from '../../../components/ui/button';
import { CloseIcon } from '../../../components/ui/icons';
import { EmptyState } from '../../../components/ui/empty-state';
import type { DocumentEdit } from '@shared/edit/document-edits';
import {
  entriesAt,
  entryAt,
  fieldText,
  parseNumber,
  parseWhole,
  wholeNumber,
  type Entry,
  type FormProps,
} from '../form-values';
import { AddMixDialog, type NewMix } from './add-mix-dialog';
import { CellSelect, CommitField } from './commit-field';
import { Cell, FormTable, HeaderCell } from './form-table';

interface ControlOption {
  id: string;
  kind: string;
  positions: number;
}

function controlOptions(data: unknown): ControlOption[] {
  return entriesAt(data, 'controls').map(({ entry }) => ({
    id: fieldText(entry.id),
    kind: fieldText(entry.kind),
    positions: wholeNumber(entry.positions) ?? 2,
  }));
}

function freeMixId(mixes: readonly { entry: Entry }[]): string {
  const taken = new Set(mixes.map(({ entry }) => fieldText(entry.id)));
  for (let n = mixes.length + 1; ; n += 1) if (!taken.has(`mix-${n}`)) return `mix-${n}`;
}

type NumberField = 'weight' | 'offset' | 'expo';

const NUMBER_FIELDS: { key: NumberField; label: string; min: number; max: number; fallback: string }[] = [
  { key: 'weight', label: 'Weight', min: -200, max: 200, fallback: '100' },
  { key: 'offset', label: 'Offset', min: -100, max: 100, fallback: '0' },
  { key: 'expo', label: 'Expo', min: 0, max: 100, fallback: '0' },
];

export function MixesForm({ data, readOnly, onEdits }: FormProps) {
  const mixes = entriesAt(data, 'mixes');
  const controls = controlOptions(data);
  const switches = controls.filter((control) => control.kind === 'switch');

  const [adding, setAdding] = useState(false);
  const addMix = ({ from, to }: NewMix) => {
    onEdits([{ kind: 'append', path: ['mixes'], value: { id: freeMixId(mixes), from, to } }]);
    setAdding(false);
  };

  return (
    <fieldset disabled={readOnly} className="min-w-0">
      <legend className="sr-only">Mixes</legend>
      <p className="mb-3 text-sm text-ink-700">
        Each mix feeds a control into a channel: weight × expo curve + offset, in percent. Mixes on one channel add up.
        Rates replace the weight with one per switch position; conditions (<code className="font-mono">active</code>)
        stay in the text.
      </p>
      {mixes.length === 0 ? (
        <EmptyState title="No mixes yet">Without mixes no control moves any channel. Add one to start.</EmptyState>
      ) : (
        <FormTable caption="Mixes" tableClassName="min-w-[42rem] [&_td]:px-1.5 [&_th]:px-1.5">
          <thead>
            <tr>
              <HeaderCell>Mix</HeaderCell>
              <HeaderCell>From</HeaderCell>
              <HeaderCell>To ch</HeaderCell>
              {NUMBER_FIELDS.map((field) => (
                <HeaderCell key={field.key}>{field.label} %</HeaderCell>
              ))}
              <HeaderCell>Rates</HeaderCell>
              {!readOnly && (
                <HeaderCell className="w-10">
                  <span className="sr-only">Actions</span>
                </HeaderCell>
              )}
            </tr>
          </thead>
          <tbody>
            {mixes.map(({ index, entry }) => (
              <MixRow
                key={index}
                index={index}
                mix={entry}
                controls={controls}
                switches={switches}
                readOnly={readOnly}
                onEdits={onEdits}
              />
            ))}
          </tbody>
        </FormTable>
      )}
      {!readOnly && (
        <Button variant="secondary" size="sm" className="mt-3" onClick={() => setAdding(true)}>
          Add a mix…
        </Button>
      )}
      {adding && <AddMixDialog data={data} controls={controls} onAdd={addMix} onClose={() => setAdding(false)} />}
    </fieldset>
  );
}

interface MixRowProps {
  index: number;
  mix: Entry;
  controls: ControlOption[];
  switches: ControlOption[];
  readOnly: boolean;
  onEdits: (edits: DocumentEdit[]) => void;
}

function MixRow({ index, mix, controls, switches, readOnly, onEdits }: MixRowProps) {
  const path = ['mixes', index] as const;
  const id = fieldText(mix.id) || `mix ${index + 1}`;
  const from = fieldText(mix.from);
  const rates = entryAt(mix, 'rates');
  const active = entryAt(mix, 'active');
  const ratesControl = rates ? fieldText(rates.control) : '';
  const ratesSwitch = switches.find((control) => control.id === ratesControl);
  const weights = Array.isArray(rates?.weights) ? (rates.weights as unknown[]) : [];

  const setRates = (control: string) => {
    if (control === '') {
      onEdits([{ kind: 'delete', path: [...path, 'rates'] }]);
      return;
    }
    const positions = switches.find((option) => option.id === control)?.positions ?? 2;
    const weight = typeof mix.weight === 'number' ? mix.weight : 100;
    const kept = weights.filter((value): value is number => typeof value === 'number');
    const next = Array.from({ length: positions }, (_, position) => kept[position] ?? weight);
    onEdits([{ kind: 'set', path: [...path, 'rates'], value: { control, weights: next } }]);
  };

  return (
    <tr>
      <Cell>
        <CommitField
          className="min-w-24"
          label={`Id of mix ${id}`}
          value={fieldText(mix.id)}
          spellCheck={false}
          onCommit={(text) => {
            if (!SLUG_PATTERN.test(text)) return 'Lower-case letters, digits and dashes, like ail-left.';
            onEdits([{ kind: 'set', path: [...path, 'id'], value: text }]);
            return null;
          }}
        />
        {active && (
          <p className="mt-1 text-xs text-ink-700">
            counts only at {fieldText(active.control)} position{' '}
            {Array.isArray(active.positions) ? active.positions.join(' or ') : '?'}
          </p>
        )}
      </Cell>
      <Cell>
        <CellSelect
          className="w-full min-w-32"
          label={`Control of mix ${id}`}
          value={from}
          onChange={(event) => onEdits([{ kind: 'set', path: [...path, 'from'], value: event.target.value }])}
        >
          {!controls.some((control) => control.id === from) && (
            <option value={from}>{from || 'choose'} (not a control)</option>
          )}
          {controls.map((control) => (
            <option key={control.id} value={control.id}>
              {control.id}
            </option>
          ))}
        </CellSelect>
      </Cell>
      <Cell>
        <CommitField
          className="min-w-14"
          label={`Target channel of mix ${id}`}
          inputMode="numeric"
          value={fieldText(mix.to)}
          onCommit={(text) => {
            const parsed = parseWhole(text, 1, 32, 'A channel');
            if (parsed.error !== undefined) return parsed.error;
            onEdits([{ kind: 'set', path: [...path, 'to'], value: parsed.value }]);
            return null;
          }}
        />
      </Cell>
      {NUMBER_FIELDS.map((field) => (
        <Cell key={field.key}>
          <CommitField
            className="min-w-14"
            label={`${field.label} of mix ${id} in percent`}
            inputMode="decimal"
            placeholder={field.fallback}
            value={fieldText(mix[field.key])}
            onCommit={(text) => {
              if (text === '') {
                onEdits([{ kind: 'delete', path: [...path, field.key] }]);
                return null;
              }
              const parsed = parseNumber(text, field.min, field.max, field.label);
              if (parsed.error !== undefined) return parsed.error;
              onEdits([{ kind: 'set', path: [...path, field.key], value: parsed.value }]);
              return null;
            }}
          />
        </Cell>
      ))}
      <Cell>
        <CellSelect
          className="w-full min-w-32"
          label={`Rates switch of mix ${id}`}
          value={ratesControl}
          onChange={(event) => setRates(event.target.value)}
        >
          <option value="">no rates</option>
          {ratesControl && !ratesSwitch && <option value={ratesControl}>{ratesControl} (not a switch)</option>}
          {switches.map((control) => (
            <option key={control.id} value={control.id}>
              {control.id}
            </option>
          ))}
        </CellSelect>
        {rates && (
          <div className="mt-1.5 flex gap-1">
            {weights.map((weight, position) => (
              <CommitField
                key={position}
                className="w-14 shrink-0"
                label={`Rate weight of mix ${id} at position ${position}`}
                title={`Weight at position ${position}`}
                inputMode="decimal"
                value={fieldText(weight)}
                onCommit={(text) => {
                  const parsed = parseNumber(text, -200, 200, 'A rate weight');
                  if (parsed.error !== undefined) return parsed.error;
                  onEdits([{ kind: 'set', path: [...path, 'rates', 'weights', position], value: parsed.value }]);
                  return null;
                }}
              />
            ))}
          </div>
        )}
      </Cell>
      {!readOnly && (
        <Cell className="text-right">
          <Button
            variant="quiet"
            size="sm"
            className="px-2"
            aria-label={`Remove mix ${id}`}
            title={`Remove mix ${id}`}
            onClick={() => onEdits([{ kind: 'delete', path: [...path] }])}
          >
            <CloseIcon />
          </Button>
        </Cell>
      )}
    </tr>
  );
}
