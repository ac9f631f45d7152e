import { useId, useState, type InputHTMLAttributes, type SelectHTMLAttributes } from 'react';
import { FieldError } from '../../../components/ui/field-error';
import { ChevronDownIcon } from '../../../components/ui/icons';
import { cx } from '../../../lib/cx';

export interface CommitFieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'value' | 'onChange' | 'id'> {
  /** Said to assistive technology; the table header says it to the eye. */
  label: string;
  value: string;
  /** Takes the typed text; answers a message when it cannot be used, null when it was applied. */
  onCommit: (text: string) => string | null;
}

/**
 * A form field that changes the document when the pilot is done with it (Enter or
 * leaving the field), not at every keystroke, so a half-typed number never reaches the
 * text. Escape puts the document's value back.
 */
export function CommitField({ label, value, onCommit, className, ...props }: CommitFieldProps) {
  const [draft, setDraft] = useState(value);
  const [error, setError] = useState<string | null>(null);
  const errorId = useId();

  // A new value from the document replaces the draft and its message.
  const [shownValue, setShownValue] = useState(value);
  if (value !== shownValue) {
    setShownValue(value);
    setDraft(value);
    setError(null);
  }

  const commit = () => {
    const typed = draft.trim();
    if (typed === value) {
      setError(null);
      return;
    }
    setError(onCommit(typed));
  };

  return (
    <div className={className}>
      <input
        aria-label={label}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? errorId : undefined}
        value={draft}
        onChange={(event) => setDraft(event.target.value)}
        onBlur={commit}
        onKeyDown={(event) => {
          if (event.key === 'Enter') {
            event.preventDefault();
            commit();
          } else if (event.key === 'Escape') {
            setDraft(value);
            setError(null);
          }
        }}
        className={cx(
          'block h-8 w-full min-w-0 rounded-md border bg-paper-raised px-2 text-sm text-ink-900 disabled:border-ply-200 disabled:bg-transparent',
          error ? 'border-2 border-danger-700' : 'border-ply-500',
        )}
        {...props}
      />
      {error && <FieldError id={errorId}>{error}</FieldError>}
    </div>
  );
}

/** A compact select for table cells, drawn like the kit's select fields beside it. */
export function CellSelect({
  label,
  className,
  ...props
}: SelectHTMLAttributes<HTMLSelectElement> & { label: string }) {
  return (
    <div className={cx('relative', className ?? 'w-full')}>
      <select
        aria-label={label}
        className="peer block h-8 w-full min-w-0 appearance-none rounded-md border border-ply-500 bg-paper-raised pr-7 pl-2 text-sm text-ink-900 disabled:border-ply-200 disabled:bg-transparent"
        {...props}
      />
      <ChevronDownIcon className="pointer-events-none absolute top-1/2 right-2 -translate-y-1/2 text-sm text-ink-700 peer-disabled:hidden" />
    </div>
  );
}
