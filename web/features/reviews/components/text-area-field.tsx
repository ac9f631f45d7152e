import { useId, type TextareaHTMLAttributes } from 'react';
import { FieldError } from '../../../components/ui/field-error';
import { cx } from '../../../lib/cx';

export interface TextAreaFieldProps extends Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'id'> {
  label: string;
  hint?: string;
  error?: string;
}

/** A labelled multi-line field in the look of the UI kit's text field. */
export function TextAreaField({ label, hint, error, className, rows = 3, ...props }: TextAreaFieldProps) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  return (
    <div className={className}>
      <label htmlFor={id} className="block text-sm font-medium text-ink-900">
        {label}
      </label>
      {hint && (
        <p id={hintId} className="mt-0.5 text-sm text-ink-500">
          {hint}
        </p>
      )}
      <textarea
        id={id}
        rows={rows}
        aria-invalid={error ? true : undefined}
        aria-describedby={[hintId, errorId].filter(Boolean).join(' ') || undefined}
        className={cx('mt-1.5 block w-full rounded-md border bg-paper-raised px-3 py-2 text-base text-ink-900 placeholder:text-ink-500', error ? 'border-2 border-danger-700' : 'border-ply-500')}
        {...props}
      />
      {error && errorId && <FieldError id={errorId}>{error}</FieldError>}
    </div>
  );
}
