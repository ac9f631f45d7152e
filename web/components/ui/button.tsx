import type { ButtonHTMLAttributes } from 'react';
import { cx } from '../../lib/cx';
import { Spinner } from './spinner';

type Variant = 'primary' | 'secondary' | 'quiet' | 'danger';
type Size = 'sm' | 'md';

const variants: Record<Variant, string> = {
  primary: 'bg-accent-700 text-white hover:bg-accent-800 border-accent-800',
  secondary: 'bg-paper-raised text-ink-900 hover:bg-ply-100 border-ply-500',
  quiet: 'bg-transparent text-accent-700 hover:bg-accent-50 border-transparent',
  danger: 'bg-danger-700 text-white hover:bg-ink-900 border-danger-700',
};

const sizes: Record<Size, string> = {
  sm: 'h-8 px-3 text-sm gap-1.5',
  md: 'h-10 px-4 text-base gap-2',
};

export const buttonClasses = (variant: Variant = 'primary', size: Size = 'md') =>
  cx(
    'inline-flex items-center justify-center rounded-md border font-medium whitespace-nowrap no-underline',
    'transition-colors disabled:cursor-not-allowed disabled:opacity-60',
    variants[variant],
    sizes[size],
  );

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: Variant;
  size?: Size;
  /** Shows a spinner and refuses clicks while the action is under way. */
  pending?: boolean;
}

export function Button({
  variant = 'primary',
  size = 'md',
  pending = false,
  className,
  children,
  disabled,
  type,
  ...props
}: ButtonProps) {
  return (
    <button
      type={type ?? 'button'}
      className={cx(buttonClasses(variant, size), className)}
      disabled={disabled || pending}
      aria-busy={pending || undefined}
      {...props}
    >
      {pending && <Spinner />}
      {children}
    </button>
  );
}
