import { fieldText, parseNumber } from '../form-values';
import { CellSelect, CommitField } from './commit-field';

type Mode = 'pulse' | 'hold' | 'off' | 'default' | 'other';

function modeOf(value: unknown): Mode {
  if (value === undefined || value === null) return 'default';
  if (typeof value === 'number') return 'pulse';
  if (value === 'hold' || value === 'off') return value;
  return 'other';
}

const DEFAULT_PULSE = 1500;

export interface FailsafeFieldProps {
  /** Names the pin, as in "pin 3". */
  name: string;
  value: unknown;
  /** undefined takes the key away: the receiver's own default then applies. */
  onChange: (value: number | 'hold' | 'off' | undefined) => void;
}

/** A pin's failsafe: a pulse in microseconds, hold, off, or unset (the receiver's default). */
export function FailsafeField({ name, value, onChange }: FailsafeFieldProps) {
  const mode = modeOf(value);
  return (
    <div className="flex items-start gap-1.5">
      <CellSelect
        label={`Failsafe of ${name}`}
        className="w-44 shrink-0"
        value={mode}
        onChange={(event) => {
          const next = event.target.value as Mode;
          if (next === 'pulse') onChange(DEFAULT_PULSE);
          else if (next === 'hold' || next === 'off') onChange(next);
          else if (next === 'default') onChange(undefined);
        }}
      >
        <option value="pulse">Pulse (µs)</option>
        <option value="hold">Hold last pulse</option>
        <option value="off">Off (no pulses)</option>
        <option value="default">Not set (the receiver's own default)</option>
        {mode === 'other' && <option value="other">{fieldText(value)}</option>}
      </CellSelect>
      {mode === 'pulse' && (
        <CommitField
          label={`Failsafe pulse of ${name} in microseconds`}
          className="w-20 shrink-0"
          inputMode="numeric"
          value={fieldText(value)}
          onCommit={(text) => {
            const parsed = parseNumber(text, 0, 5000, 'A failsafe pulse');
            if (parsed.error !== undefined) return parsed.error;
            onChange(parsed.value);
            return null;
          }}
        />
      )}
    </div>
  );
}
