import { Fragment, useState } from 'react';
import type { TextDiff, TextRow, TextRowKind } from '@shared/diff';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { cx } from '../../../lib/cx';

// A sign beside each changed line, so the marking does not rest on colour alone.
const SIGNS: Record<TextRowKind, { left: string; right: string; word: string }> = {
  same: { left: '', right: '', word: '' },
  added: { left: '', right: '+', word: 'added' },
  removed: { left: '−', right: '', word: 'removed' },
  changed: { left: '~', right: '~', word: 'changed' },
};

const LEFT_TONE: Record<TextRowKind, string> = {
  same: '',
  added: 'bg-ply-100/60',
  removed: 'bg-danger-100',
  changed: 'bg-caution-100',
};
const RIGHT_TONE: Record<TextRowKind, string> = {
  same: '',
  added: 'bg-moss-100',
  removed: 'bg-ply-100/60',
  changed: 'bg-caution-100',
};

function Side({
  side,
  kind,
  tone,
  sign,
  divider = false,
}: {
  side: TextRow['left'];
  kind: TextRowKind;
  tone: string;
  sign: string;
  divider?: boolean;
}) {
  return (
    <>
      <td
        className={cx(
          'border-r border-ply-200 px-2 text-right align-top text-ink-500 select-none',
          divider && 'border-l border-l-ply-500',
          tone,
        )}
      >
        {side?.line ?? ''}
      </td>
      <td className={cx('px-1 align-top font-semibold text-ink-700 select-none', tone)}>
        {side && sign}
        {side && kind !== 'same' && <span className="sr-only"> {SIGNS[kind].word}</span>}
      </td>
      <td className={cx('px-2 align-top whitespace-pre-wrap text-ink-900 [overflow-wrap:anywhere]', tone)}>
        {side?.text ?? ''}
      </td>
    </>
  );
}

/** The two YAML texts side by side, changed lines marked; runs of unchanged lines fold away. */
export function TextDiffView({ diff, fromLabel, toLabel }: { diff: TextDiff; fromLabel: string; toLabel: string }) {
  const [expanded, setExpanded] = useState(false);
  const changed = diff.hunks.length > 0;
  // Folded, the view shows the hunks and a line for each gap between them.
  const pieces: ({ type: 'rows'; start: number; end: number } | { type: 'gap'; count: number })[] = [];
  if (expanded || !changed) pieces.push({ type: 'rows', start: 0, end: diff.rows.length });
  else {
    let at = 0;
    for (const hunk of diff.hunks) {
      if (hunk.start > at) pieces.push({ type: 'gap', count: hunk.start - at });
      pieces.push({ type: 'rows', start: hunk.start, end: hunk.end });
      at = hunk.end;
    }
    if (at < diff.rows.length) pieces.push({ type: 'gap', count: diff.rows.length - at });
  }

  return (
    <Card className="overflow-hidden">
      <div className="flex flex-wrap items-center gap-3 border-b border-ply-200 bg-paper px-4 py-2 text-sm text-ink-700">
        <span>
          {diff.removed} {diff.removed === 1 ? 'line' : 'lines'} only in {fromLabel}, {diff.added} only in {toLabel}
        </span>
        {changed && (
          <Button size="sm" variant="quiet" className="ml-auto" onClick={() => setExpanded((value) => !value)}>
            {expanded ? 'Fold unchanged lines' : 'Show every line'}
          </Button>
        )}
      </div>
      <div className="overflow-x-auto">
        <table className="w-full table-fixed border-collapse font-mono text-xs leading-5 sm:text-sm">
          <caption className="sr-only">
            {fromLabel} on the left, {toLabel} on the right
          </caption>
          <colgroup>
            <col className="w-10" />
            <col className="w-5" />
            <col />
            <col className="w-10" />
            <col className="w-5" />
            <col />
          </colgroup>
          <thead className="border-b border-ply-200 font-sans text-sm text-ink-700">
            <tr>
              <th scope="col" colSpan={3} className="px-3 py-1.5 text-left font-medium">
                {fromLabel}
              </th>
              <th scope="col" colSpan={3} className="border-l border-ply-300 px-3 py-1.5 text-left font-medium">
                {toLabel}
              </th>
            </tr>
          </thead>
          <tbody>
            {pieces.map((piece, index) =>
              piece.type === 'gap' ? (
                <tr key={`gap-${index}`}>
                  <td
                    colSpan={6}
                    className="border-y border-ply-200 bg-ply-100 px-3 py-1 text-center font-sans text-xs text-ink-700"
                  >
                    {piece.count} unchanged {piece.count === 1 ? 'line' : 'lines'}
                  </td>
                </tr>
              ) : (
                <Fragment key={`rows-${index}`}>
                  {diff.rows.slice(piece.start, piece.end).map((row, offset) => (
                    <tr key={piece.start + offset}>
                      <Side side={row.left} kind={row.kind} tone={LEFT_TONE[row.kind]} sign={SIGNS[row.kind].left} />
                      <Side
                        side={row.right}
                        kind={row.kind}
                        tone={RIGHT_TONE[row.kind]}
                        sign={SIGNS[row.kind].right}
                        divider
                      />
                    </tr>
                  ))}
                </Fragment>
              ),
            )}
          </tbody>
        </table>
      </div>
    </Card>
  );
}
