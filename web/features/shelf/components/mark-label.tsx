import { MARK_SWATCHES, type MarkColour } from '@shared/reuse/receiver-fields';
import { cx } from '../../../lib/cx';

/** The mark on a unit's case: its words, with a swatch of its colour beside them (never the colour alone). */
export function MarkLabel({
  mark,
  colour,
  className,
}: {
  mark: string | null;
  colour: MarkColour | null;
  className?: string;
}) {
  if (!mark && !colour) return <span className={cx('text-ink-500', className)}>No mark</span>;
  return (
    <span className={cx('inline-flex items-start gap-1.5', className)}>
      {colour && (
        <span
          aria-hidden="true"
          className="mt-[0.3em] inline-block h-3.5 w-3.5 shrink-0 rounded-full border border-ink-700/60 print:border-ink-900"
          // Browsers leave backgrounds out of print unless told; the swatch is the point of it on a field sheet.
          style={{ backgroundColor: MARK_SWATCHES[colour], printColorAdjust: 'exact', WebkitPrintColorAdjust: 'exact' }}
        />
      )}
      <span>{mark ?? `${colour} (no words)`}</span>
      {colour && mark && !mark.toLowerCase().includes(colour) && (
        <span className="text-sm text-ink-500">({colour})</span>
      )}
    </span>
  );
}
