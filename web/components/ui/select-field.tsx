import type { ReactNode, Ref, SelectHTMLAttributes } from 'react';
import { cx } from '../../lib/cx';
import { ChevronDownIcon } from './icons';
import { LabelledField } from './labelled-field';

export interface SelectFieldProps extends Omit<SelectHTMLAttributes<HTMLSelectElement>, 'id'> {
  label: string;
  /** Keeps the label for screen readers only, where the context already says it. */
  hideLabel?: boolean;
  error?: string;
  children: ReactNode;
  ref?: Ref<HTMLSelectElement>;
}

export function SelectField({ label, hideLabel = false, error, className, children, ref, ...props }: SelectFieldProps) {
  return (
    <LabelledField label={label} hideLabel={hideLabel} error={error} className={className}>
      {(control) => (
        <div className={cx('relative', !hideLabel && 'mt-1.5')}>
          <select
            {...control}
            ref={ref}
            className={cx(
              'block h-10 w-full appearance-none rounded-md border bg-paper-raised pr-9 pl-3 text-base text-ink-900',
              error ? 'border-danger-700 border-2' : 'border-ply-500',
            )}
            {...props}
          >
            {children}
          </select>
          <ChevronDownIcon className="pointer-events-none absolute top-1/2 right-3 -translate-y-1/2 text-ink-700" />
        </div>
      )}
    </LabelledField>
  );
}
