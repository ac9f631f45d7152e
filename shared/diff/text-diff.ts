import { diffLines } from 'diff';

export type TextRowKind = 'same' | 'added' | 'removed' | 'changed';

/** One row of a side-by-side view; `left` / `right` are null where that side has no line. */
export interface TextRow {
  kind: TextRowKind;
  left: { line: number; text: string } | null;
  right: { line: number; text: string } | null;
}

/** Rows `start` (inclusive) to `end` (exclusive) with changes and their context; the rows between hunks can be collapsed. */
export interface TextHunk {
  start: number;
  end: number;
}

export interface TextDiff {
  rows: TextRow[];
  hunks: TextHunk[];
  /** Lines only in the old text, lines only in the new one. */
  removed: number;
  added: number;
  /**
   * False when the texts differ too much for a line-by-line match within the time a
   * compare may take: the rows then show the common start and end, and everything in
   * between as one changed block.
   */
  exact: boolean;
}

const CONTEXT_LINES = 3;
// Myers' algorithm costs about (lines x edits); past this many edits (a reformatted
// file, say) the diff stops looking for the shortest script and falls back.
const MAX_EDITS = 500;

interface Part {
  value: string;
  added?: boolean;
  removed?: boolean;
}

// Common leading and trailing lines kept, the middle replaced: a correct (if not the
// shortest) line diff in linear time.
function coarseParts(beforeText: string, afterText: string): Part[] {
  const a = beforeText.split(/(?<=\n)/);
  const b = afterText.split(/(?<=\n)/);
  let head = 0;
  while (head < a.length && head < b.length && a[head] === b[head]) head++;
  let tail = 0;
  while (tail < a.length - head && tail < b.length - head && a[a.length - 1 - tail] === b[b.length - 1 - tail]) tail++;
  const parts: Part[] = [
    { value: a.slice(0, head).join('') },
    { value: a.slice(head, a.length - tail).join(''), removed: true },
    { value: b.slice(head, b.length - tail).join(''), added: true },
    { value: a.slice(a.length - tail).join('') },
  ];
  return parts.filter((part) => part.value !== '');
}

function lines(value: string): string[] {
  const parts = value.split('\n');
  if (parts[parts.length - 1] === '') parts.pop();
  return parts.map((part) => (part.endsWith('\r') ? part.slice(0, -1) : part));
}

/**
 * The line diff of two YAML texts (Myers' algorithm, through the `diff` package),
 * laid out for a side-by-side view: a run of removed lines followed by added ones is
 * paired row by row as `changed`, the surplus stays `removed` or `added`. Texts
 * with more than MAX_EDITS line edits get the coarse diff instead (`exact: false`).
 */
export function textDiff(beforeText: string, afterText: string): TextDiff {
  const myers = diffLines(beforeText, afterText, { maxEditLength: MAX_EDITS });
  const parts: Part[] = myers ?? coarseParts(beforeText, afterText);
  const rows: TextRow[] = [];
  let leftLine = 1;
  let rightLine = 1;
  let removed = 0;
  let added = 0;
  for (let index = 0; index < parts.length; index++) {
    const part = parts[index];
    if (!part.added && !part.removed) {
      for (const line of lines(part.value)) {
        rows.push({ kind: 'same', left: { line: leftLine++, text: line }, right: { line: rightLine++, text: line } });
      }
      continue;
    }
    const gone = part.removed ? lines(part.value) : [];
    const next = part.removed && parts[index + 1]?.added ? parts[++index] : part.added ? part : undefined;
    const come = next ? lines(next.value) : [];
    removed += gone.length;
    added += come.length;
    for (let k = 0; k < Math.max(gone.length, come.length); k++) {
      const left = k < gone.length ? { line: leftLine++, text: gone[k] } : null;
      const right = k < come.length ? { line: rightLine++, text: come[k] } : null;
      rows.push({ kind: left && right ? 'changed' : left ? 'removed' : 'added', left, right });
    }
  }
  return { rows, hunks: hunks(rows), removed, added, exact: myers !== undefined };
}

function hunks(rows: TextRow[]): TextHunk[] {
  const result: TextHunk[] = [];
  rows.forEach((row, index) => {
    if (row.kind === 'same') return;
    const start = Math.max(0, index - CONTEXT_LINES);
    const end = Math.min(rows.length, index + CONTEXT_LINES + 1);
    const last = result[result.length - 1];
    if (last && start <= last.end) last.end = Math.max(last.end, end);
    else result.push({ start, end });
  });
  return result;
}
