import type { ReactNode } from 'react';
import { cx } from '../../../lib/cx';

export function BenchTable({ caption, children }: { caption: string; children: ReactNode }) {
  return (
    // On a phone a wide table scrolls inside its card; the region takes focus so a keyboard can scroll it too.
    <div className="overflow-x-auto" role="region" aria-label={caption} tabIndex={0}>
      <table className="w-full border-collapse text-left text-sm">
        <caption className="sr-only">{caption}</caption>
        {children}
      </table>
    </div>
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
  className,
  numeric = false,
}: {
  children?: ReactNode;
  className?: string;
  numeric?: boolean;
}) {
  return (
    <td
      className={cx(
        'border-b border-ply-100 px-2.5 py-1.5 align-middle',
        numeric && 'text-right font-mono tabular-nums',
        className,
      )}
    >
      {children}
    </td>
  );
}
