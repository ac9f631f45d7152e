import { useId, type ReactNode } from 'react';
import { cx } from '../../lib/cx';
import { FieldError } from './field-error';

/** What a kit field hands its control so the label, hint and error are tied to it. */
export interface FieldControlProps {
  id: string;
  'aria-invalid': true | undefined;
  'aria-describedby': string | undefined;
}

export interface LabelledFieldProps {
  label: string;
  /** Keeps the label for screen readers only, where the context already says it. */
  hideLabel?: boolean;
  hint?: string;
  /** A message from the server or the form; shown under the field and announced with it. */
  error?: string;
  className?: string;
  children: (control: FieldControlProps) => ReactNode;
}

/** The label, hint and error every field of the kit draws around its own control. */
export function LabelledField({ label, hideLabel = false, hint, error, className, children }: LabelledFieldProps) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(' ') || undefined;

  return (
    <div className={className}>
      <label htmlFor={id} className={hideLabel ? 'sr-only' : 'block text-sm font-medium text-ink-900'}>
        {label}
      </label>
      {hint && (
        <p id={hintId} className="mt-0.5 text-sm text-ink-500">
          {hint}
        </p>
      )}
      {children({ id, 'aria-invalid': error ? true : undefined, 'aria-describedby': describedBy })}
      {error && errorId && <FieldError id={errorId}>{error}</FieldError>}
    </div>
  );
}

/** The box of a typed-in control; a refused one gets a heavier red border, not colour alone. */
export function fieldBoxClass(error: string | undefined): string {
  return cx(
    'block w-full rounded-md border bg-paper-raised text-base text-ink-900 placeholder:text-ink-500',
    error ? 'border-danger-700 border-2' : 'border-ply-500',
  );
}
