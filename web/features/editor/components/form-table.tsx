import type { ReactNode } from 'react';
import { cx } from '../../../lib/cx';

// The tables the forms are drawn in: a header row of small caps words, rows ruled
// like a workbench ledger, scrolling sideways on a narrow tablet rather than squeezing.

export function FormTable({
  caption,
  children,
  className,
  tableClassName,
}: {
  caption: string;
  children: ReactNode;
  className?: string;
  tableClassName?: string;
}) {
  return (
    <div className={cx('overflow-x-auto rounded-lg border border-ply-200 bg-paper-raised', className)}>
      <table className={cx('w-full border-collapse text-left text-sm', tableClassName)}>
        <caption className="sr-only">{caption}</caption>
        {children}
      </table>
    </div>
  );
}

export function HeaderCell({ children, className }: { children?: ReactNode; className?: string }) {
  return (
    <th
      scope="col"
      className={cx(
        'border-b border-ply-200 bg-paper px-2 py-2 text-xs font-medium tracking-wide text-ink-700 uppercase',
        className,
      )}
    >
      {children}
    </th>
  );
}

export function Cell({ children, className }: { children?: ReactNode; className?: string }) {
  return <td className={cx('border-b border-ply-100 px-2 py-1.5 align-top', className)}>{children}</td>;
}
