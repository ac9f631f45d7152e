import type { YamlPath } from '@shared/edit/document-edits';
import { fieldText, parseNumber, parseWhole, type ApplyEdits } from '../form-values';
import { CommitField } from './commit-field';

/**
 * A number of the setup typed into a form and written at `path` when the field is left:
 * a whole number or a decimal within its range, refused beside the field otherwise
 * (nothing written). An optional one is removed from the text when emptied.
 */
export function NumberField({
  label,
  value,
  path,
  min,
  max,
  what,
  decimal = false,
  optional = false,
  onEdits,
  className,
}: {
  label: string;
  value: unknown;
  path: YamlPath;
  min: number;
  max: number;
  /** The number's name in the refusal: "A channel is a whole number from 1 to 32." */
  what: string;
  decimal?: boolean;
  optional?: boolean;
  onEdits: ApplyEdits;
  className?: string;
}) {
  return (
    <CommitField
      className={className}
      label={label}
      inputMode={decimal ? 'decimal' : 'numeric'}
      value={fieldText(value)}
      onCommit={(text) => {
        if (optional && text === '') {
          onEdits([{ kind: 'delete', path }]);
          return null;
        }
        const parsed = (decimal ? parseNumber : parseWhole)(text, min, max, what);
        if (parsed.error !== undefined) return parsed.error;
        onEdits([{ kind: 'set', path, value: parsed.value }]);
        return null;
      }}
    />
  );
}
