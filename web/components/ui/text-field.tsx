import { useId, type InputHTMLAttributes, type Ref } from 'react';
import { cx } from '../../lib/cx';
import { FieldError } from './field-error';

export interface TextFieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> {
  label: string;
  /** A message from the server or the form; shown under the field and announced with it. */
  error?: string;
  hint?: string;
  ref?: Ref<HTMLInputElement>;
}

export function TextField({ label, error, hint, className, ref, ...props }: TextFieldProps) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(' ') || undefined;

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
      <input
        id={id}
        ref={ref}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={cx(
          'mt-1.5 block h-10 w-full rounded-md border bg-paper-raised px-3 text-base text-ink-900',
          'placeholder:text-ink-500',
          error ? 'border-danger-700 border-2' : 'border-ply-500',
        )}
        {...props}
      />
      {error && errorId && <FieldError id={errorId}>{error}</FieldError>}
    </div>
  );
}
