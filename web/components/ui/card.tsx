import type { HTMLAttributes } from 'react';
import { cx } from '../../lib/cx';

/** A raised board on the bench: groups one thing's details. */
export function Card({ className, ...props }: HTMLAttributes<HTMLDivElement>) {
  return <div className={cx('rounded-lg border border-ply-200 bg-paper-raised shadow-card', className)} {...props} />;
}
