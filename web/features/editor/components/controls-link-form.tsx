import { CONTROL_KINDS, SLUG_PATTERN } from '@shared/format/schema';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { entriesAt, entryAt, fieldText, wholeNumber, type FormProps } from '../form-values';
import { CellSelect, CommitField } from './commit-field';
import { Cell, FormTable, HeaderCell } from './form-table';
import { NumberField } from './number-field';

// The link (how many channels the radio carries) and the transmitter's controls, on the
// same document as the text. A control's id is what mixes, rates and cuts name, so a
// renamed id leaves those pointing at the old one: the checks then say where.

const KIND_WORDS: Record<string, string> = {
  axis: 'stick axis',
  knob: 'knob',
  slider: 'slider',
  switch: 'switch',
};

function freeControlId(taken: readonly string[]): string {
  for (let n = taken.length + 1; ; n += 1) if (!taken.includes(`control-${n}`)) return `control-${n}`;
}

export function ControlsLinkForm({ data, readOnly, onEdits }: FormProps) {
  const link = entryAt(data, 'link');
  const controls = entriesAt(data, 'controls');
  const ids = controls.map(({ entry }) => fieldText(entry.id));

  return (
    <fieldset disabled={readOnly} className="min-w-0 space-y-6">
      <legend className="sr-only">Controls and link</legend>
      <section aria-labelledby="link-form-heading">
        <h3 id="link-form-heading" className="text-base font-semibold text-ink-900">
          Link
        </h3>
        <p className="mb-2 text-sm text-ink-700">
          How many channels the radio link carries in the mode it is set to. A channel above this count never reaches a
          receiver.
        </p>
        <div className="flex flex-wrap gap-4">
          <label className="block w-40 text-sm text-ink-900">
            Channels the link carries
            <NumberField
              className="mt-1"
              label="Channels the link carries, 4 to 32"
              value={link?.channels}
              path={['link', 'channels']}
              min={4}
              max={32}
              what="The channel count"
              onEdits={onEdits}
            />
          </label>
          <label className="block w-48 text-sm text-ink-900">
            Packet rate in Hz (optional)
            <NumberField
              className="mt-1"
              label="Packet rate in hertz, optional"
              value={link?.packet_rate_hz}
              path={['link', 'packet_rate_hz']}
              min={1}
              max={10_000}
              what="The packet rate"
              decimal
              optional
              onEdits={onEdits}
            />
          </label>
        </div>
      </section>

      <section aria-labelledby="controls-form-heading">
        <h3 id="controls-form-heading" className="text-base font-semibold text-ink-900">
          Controls
        </h3>
        <p className="mb-2 text-sm text-ink-700">
          The transmitter&apos;s sticks, knobs, sliders and switches, by the names your mixes use. A switch has 2 or 3
          positions.
        </p>
        {controls.length === 0 ? (
          <EmptyState title="No controls yet">Add the transmitter&apos;s controls: mixes start from them.</EmptyState>
        ) : (
          <FormTable caption="Controls">
            <thead>
              <tr>
                <HeaderCell>Id</HeaderCell>
                <HeaderCell className="w-36">Kind</HeaderCell>
                <HeaderCell className="w-28">Positions</HeaderCell>
                <HeaderCell>Label on the transmitter</HeaderCell>
                {!readOnly && (
                  <HeaderCell className="w-24">
                    <span className="sr-only">Actions</span>
                  </HeaderCell>
                )}
              </tr>
            </thead>
            <tbody>
              {controls.map(({ index, entry }) => {
                const id = fieldText(entry.id);
                const kind = fieldText(entry.kind);
                const name = id || `row ${index + 1}`;
                const path = ['controls', index];
                return (
                  <tr key={index}>
                    <Cell>
                      <CommitField
                        label={`Id of control ${name}`}
                        value={id}
                        spellCheck={false}
                        onCommit={(text) => {
                          if (!SLUG_PATTERN.test(text))
                            return 'Lower-case letters, digits and dashes, like flap-switch.';
                          if (ids.some((other, at) => other === text && at !== index))
                            return `Another control is already called ${text}.`;
                          onEdits([{ kind: 'set', path: [...path, 'id'], value: text }]);
                          return null;
                        }}
                      />
                    </Cell>
                    <Cell>
                      <CellSelect
                        label={`Kind of control ${name}`}
                        value={kind}
                        onChange={(event) => {
                          const next = event.target.value;
                          // Only switches have positions: the key follows the kind.
                          onEdits([
                            { kind: 'set', path: [...path, 'kind'], value: next },
                            next === 'switch'
                              ? { kind: 'set', path: [...path, 'positions'], value: wholeNumber(entry.positions) ?? 2 }
                              : { kind: 'delete', path: [...path, 'positions'] },
                          ]);
                        }}
                      >
                        {!(CONTROL_KINDS as readonly string[]).includes(kind) && (
                          <option value={kind}>{kind || 'choose'}</option>
                        )}
                        {CONTROL_KINDS.map((option) => (
                          <option key={option} value={option}>
                            {KIND_WORDS[option]}
                          </option>
                        ))}
                      </CellSelect>
                    </Cell>
                    <Cell>
                      {kind === 'switch' ? (
                        <CellSelect
                          label={`Positions of switch ${name}`}
                          value={String(wholeNumber(entry.positions) ?? 2)}
                          onChange={(event) =>
                            onEdits([{ kind: 'set', path: [...path, 'positions'], value: Number(event.target.value) }])
                          }
                        >
                          <option value="2">2</option>
                          <option value="3">3</option>
                        </CellSelect>
                      ) : (
                        <span className="text-sm text-ink-500">
                          <span aria-hidden="true">–</span>
                          <span className="sr-only">not a switch</span>
                        </span>
                      )}
                    </Cell>
                    <Cell>
                      <CommitField
                        label={`Label of control ${name}`}
                        value={fieldText(entry.label)}
                        onCommit={(text) => {
                          onEdits([
                            text === ''
                              ? { kind: 'delete', path: [...path, 'label'] }
                              : { kind: 'set', path: [...path, 'label'], value: text },
                          ]);
                          return null;
                        }}
                      />
                    </Cell>
                    {!readOnly && (
                      <Cell className="text-right">
                        <Button
                          variant="quiet"
                          size="sm"
                          aria-label={`Remove control ${name}`}
                          onClick={() => onEdits([{ kind: 'delete', path }])}
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
        )}
        {!readOnly && (
          <Button
            variant="secondary"
            size="sm"
            className="mt-3"
            onClick={() =>
              onEdits([{ kind: 'append', path: ['controls'], value: { id: freeControlId(ids), kind: 'knob' } }])
            }
          >
            Add a control
          </Button>
        )}
      </section>
    </fieldset>
  );
}
