import type { ReactNode } from 'react';
import { cx } from '../../../lib/cx';

// On a phone (below the `sm` width) a bench table is read row by row: each row stacks
// into a small card and each cell names its column beside its value (the cell's
// `label`), since five or six columns of pins and pulses do not fit 375 px without
// scrolling sideways. The header row stays for screen readers only; it is absolutely
// placed, so the table's box is `relative` to keep it from widening the page.

export function BenchTable({ caption, children }: { caption: string; children: ReactNode }) {
  return (
    // A wider table still scrolls inside its card; the region takes focus so a keyboard can scroll it too.
    <div className="relative overflow-x-auto" role="region" aria-label={caption} tabIndex={0}>
      <table className="w-full border-collapse text-left text-sm max-sm:block [&>tbody]:max-sm:block">
        <caption className="sr-only">{caption}</caption>
        {children}
      </table>
    </div>
  );
}

export function BenchHead({ children }: { children: ReactNode }) {
  return <thead className="max-sm:sr-only">{children}</thead>;
}

export function BenchRow({ children, className }: { children: ReactNode; className?: string }) {
  return (
    <tr className={cx('max-sm:block max-sm:border-b max-sm:border-ply-200 max-sm:py-1.5', className)}>{children}</tr>
  );
}

export function Th({
  children,
  className,
  numeric = false,
}: {
  children?: ReactNode;
  className?: string;
  numeric?: boolean;
}) {
  return (
    <th
      scope="col"
      className={cx(
        'border-b-2 border-ply-300 px-2.5 py-2 text-xs font-medium tracking-wide text-ink-700 uppercase',
        numeric && 'text-right',
        className,
      )}
    >
      {children}
    </th>
  );
}

export function Td({
  children,
  label,
  className,
  numeric = false,
}: {
  children?: ReactNode;
  /** The column's name, shown beside the value when the row is stacked on a phone. */
  label: string;
  className?: string;
  numeric?: boolean;
}) {
  return (
    <td
      data-label={label}
      className={cx(
        'border-b border-ply-100 px-2.5 py-1.5 align-middle',
        numeric && 'text-right font-mono tabular-nums',
        'max-sm:flex max-sm:items-center max-sm:justify-between max-sm:gap-3 max-sm:border-0 max-sm:px-0 max-sm:py-0.5',
        'max-sm:before:shrink-0 max-sm:before:font-sans max-sm:before:text-xs max-sm:before:font-normal max-sm:before:text-ink-700 max-sm:before:content-[attr(data-label)]',
        className,
      )}
    >
      {children}
    </td>
  );
}
