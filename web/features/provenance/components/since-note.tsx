import { useId, type ReactNode } from 'react';
import { cx } from '../../../lib/cx';
import { latestUnder, sinceText, type Provenance } from '../since';

/**
 * A value that tells where it came from: hovering or focusing it (it takes keyboard
 * focus) shows the revision that last changed it, its author, date and message.
 */
export function SinceNote({
  provenance,
  path,
  children,
  className,
}: {
  provenance: Provenance | undefined;
  path: string;
  children: ReactNode;
  className?: string;
}) {
  const id = useId();
  const entry = latestUnder(provenance, path);
  if (!entry) return <span className={className}>{children}</span>;
  return (
    <span
      tabIndex={0}
      aria-describedby={id}
      data-provenance={path}
      className={cx(
        'group/since relative cursor-help rounded-xs underline decoration-ply-300 decoration-dotted underline-offset-2 focus-visible:outline-2 focus-visible:outline-offset-1 focus-visible:outline-ink-900',
        className,
      )}
    >
      {children}
      <span
        id={id}
        role="tooltip"
        className="pointer-events-none absolute top-full left-0 z-20 mt-1 hidden w-64 rounded-sm border border-ply-300 bg-paper-raised px-2 py-1 text-xs font-normal whitespace-normal text-ink-900 no-underline shadow-card group-hover/since:block group-focus/since:block print:hidden"
      >
        {sinceText(entry)}
      </span>
    </span>
  );
}
