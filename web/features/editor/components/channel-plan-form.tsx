import { CHANNEL_ROLES, SIDES, SLUG_PATTERN } from '@shared/format/schema';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { entriesAt, fieldText, wholeNumber, type FormProps } from '../form-values';
import { CellSelect, CommitField } from './commit-field';
import { Cell, FormTable, HeaderCell } from './form-table';
import { NumberField } from './number-field';

const HIGHEST_CHANNEL = 32;

/** The first channel number no plan entry uses, so a new row starts without a conflict. */
function freeChannel(used: readonly (number | null)[]): number {
  for (let ch = 1; ch <= HIGHEST_CHANNEL; ch += 1) if (!used.includes(ch)) return ch;
  return HIGHEST_CHANNEL;
}

export function ChannelPlanForm({ data, readOnly, onEdits }: FormProps) {
  const channels = entriesAt(data, 'channels');
  const used = channels.map(({ entry }) => wholeNumber(entry.ch));

  const addChannel = () => {
    const ch = freeChannel(used);
    onEdits([{ kind: 'append', path: ['channels'], value: { ch, function: `channel-${ch}`, role: 'aux' } }]);
  };

  return (
    <fieldset disabled={readOnly} className="min-w-0">
      <legend className="sr-only">Channel plan</legend>
      <p className="mb-3 text-sm text-ink-700">
        One function per channel. Travel and cut stay in the text
        {readOnly ? '.' : '; changes here edit the same document.'}
      </p>
      {channels.length === 0 ? (
        <EmptyState title="No channels planned yet">Add the first channel, or write the plan in the text.</EmptyState>
      ) : (
        <FormTable caption="Channel plan">
          <thead>
            <tr>
              <HeaderCell className="w-24">Channel</HeaderCell>
              <HeaderCell>Function</HeaderCell>
              <HeaderCell className="w-36">Role</HeaderCell>
              <HeaderCell className="w-28">Side</HeaderCell>
              {!readOnly && (
                <HeaderCell className="w-24">
                  <span className="sr-only">Actions</span>
                </HeaderCell>
              )}
            </tr>
          </thead>
          <tbody>
            {channels.map(({ index, entry }) => {
              const name = `row ${index + 1}`;
              const role = fieldText(entry.role);
              const side = fieldText(entry.side);
              return (
                <tr key={index}>
                  <Cell>
                    <NumberField
                      label={`Channel, ${name}`}
                      value={entry.ch}
                      path={['channels', index, 'ch']}
                      min={1}
                      max={HIGHEST_CHANNEL}
                      what="A channel"
                      onEdits={onEdits}
                    />
                  </Cell>
                  <Cell>
                    <CommitField
                      label={`Function, ${name}`}
                      value={fieldText(entry.function)}
                      spellCheck={false}
                      onCommit={(text) => {
                        if (!SLUG_PATTERN.test(text)) return 'Lower-case letters, digits and dashes, like flap-left.';
                        onEdits([{ kind: 'set', path: ['channels', index, 'function'], value: text }]);
                        return null;
                      }}
                    />
                  </Cell>
                  <Cell>
                    <CellSelect
                      label={`Role, ${name}`}
                      value={role}
                      onChange={(event) =>
                        onEdits([{ kind: 'set', path: ['channels', index, 'role'], value: event.target.value }])
                      }
                    >
                      {!(CHANNEL_ROLES as readonly string[]).includes(role) && (
                        <option value={role}>{role || 'choose'}</option>
                      )}
                      {CHANNEL_ROLES.map((option) => (
                        <option key={option} value={option}>
                          {option}
                        </option>
                      ))}
                    </CellSelect>
                  </Cell>
                  <Cell>
                    <CellSelect
                      label={`Side, ${name}`}
                      value={side}
                      onChange={(event) =>
                        onEdits([
                          event.target.value === ''
                            ? { kind: 'delete', path: ['channels', index, 'side'] }
                            : { kind: 'set', path: ['channels', index, 'side'], value: event.target.value },
                        ])
                      }
                    >
                      <option value="">none</option>
                      {!(['', ...SIDES] as string[]).includes(side) && <option value={side}>{side}</option>}
                      {SIDES.map((option) => (
                        <option key={option} value={option}>
                          {option}
                        </option>
                      ))}
                    </CellSelect>
                  </Cell>
                  {!readOnly && (
                    <Cell className="text-right">
                      <Button
                        variant="quiet"
                        size="sm"
                        aria-label={`Remove ${name}, channel ${fieldText(entry.ch)}`}
                        onClick={() => onEdits([{ kind: 'delete', path: ['channels', index] }])}
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
        <Button variant="secondary" size="sm" className="mt-3" onClick={addChannel}>
          Add a channel
        </Button>
      )}
    </fieldset>
  );
}
