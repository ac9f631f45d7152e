import { useId, useState, type ReactNode } from 'react';
import { cx } from '../../../lib/cx';
import { latestUnder, sinceText, type Provenance } from '../since';

/**
 * A value that tells where it came from: hovering or focusing it (it takes keyboard
 * focus) shows the revision that last changed it, its author, date and message. The
 * note exists only while shown, so printed sheets and copied text hold the values alone.
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
  const [hovered, setHovered] = useState(false);
  const [focused, setFocused] = useState(false);
  const entry = latestUnder(provenance, path);
  if (!entry) return <span className={className}>{children}</span>;
  return (
    <span
      tabIndex={0}
      aria-describedby={hovered || focused ? id : undefined}
      onMouseEnter={() => setHovered(true)}
      onMouseLeave={() => setHovered(false)}
      onFocus={() => setFocused(true)}
      onBlur={() => setFocused(false)}
      data-provenance={path}
      className={cx(
        // Positioned only while the note shows: a positioned span is painted in a layer
        // of its own, which would move its text out of reading order in a printed PDF.
        (hovered || focused) && 'relative',
        'cursor-help rounded-xs underline decoration-ply-300 decoration-dotted underline-offset-2 focus-visible:outline-2 focus-visible:outline-offset-1 focus-visible:outline-ink-900',
        className,
      )}
    >
      {children}
      {(hovered || focused) && (
        <span
          id={id}
          role="tooltip"
          className="pointer-events-none absolute top-full left-0 z-20 mt-1 block w-64 rounded-sm border border-ply-300 bg-paper-raised px-2 py-1 text-xs font-normal whitespace-normal text-ink-900 no-underline shadow-card print:hidden"
        >
          {sinceText(entry)}
        </span>
      )}
    </span>
  );
}
