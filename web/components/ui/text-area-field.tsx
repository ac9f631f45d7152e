import type { Ref, TextareaHTMLAttributes } from 'react';
import { cx } from '../../lib/cx';
import { fieldBoxClass, LabelledField } from './labelled-field';

export interface TextAreaFieldProps extends Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'id'> {
  label: string;
  /** A message from the server or the form; shown under the field and announced with it. */
  error?: string;
  hint?: string;
  ref?: Ref<HTMLTextAreaElement>;
}

/** The multi-line sibling of TextField: same label, hint, error and box. */
export function TextAreaField({ label, error, hint, className, rows = 3, ref, ...props }: TextAreaFieldProps) {
  return (
    <LabelledField label={label} hint={hint} error={error} className={className}>
      {(control) => (
        <textarea
          {...control}
          ref={ref}
          rows={rows}
          className={cx('mt-1.5 px-3 py-2', fieldBoxClass(error))}
          {...props}
        />
      )}
    </LabelledField>
  );
}
