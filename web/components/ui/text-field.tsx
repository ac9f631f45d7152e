import type { InputHTMLAttributes, Ref } from 'react';
import { cx } from '../../lib/cx';
import { fieldBoxClass, LabelledField } from './labelled-field';

export interface TextFieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> {
  label: string;
  /** A message from the server or the form; shown under the field and announced with it. */
  error?: string;
  hint?: string;
  ref?: Ref<HTMLInputElement>;
}

export function TextField({ label, error, hint, className, ref, ...props }: TextFieldProps) {
  return (
    <LabelledField label={label} hint={hint} error={error} className={className}>
      {(control) => (
        <input {...control} ref={ref} className={cx('mt-1.5 h-10 px-3', fieldBoxClass(error))} {...props} />
      )}
    </LabelledField>
  );
}
