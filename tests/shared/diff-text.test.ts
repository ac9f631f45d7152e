import { diffArrays } from 'diff';
import { describe, expect, it } from 'vitest';
import { textDiff } from '../../shared/diff';
import { loadPair } from './diff-pairs';

const asLines = (letters: string) => `${letters.split('').join('\n')}\n`;

describe('text diff', () => {
  it('finds the shortest edit script of the Myers paper example: D = 5', () => {
    // [myers-1986] A = ABCABBA, B = CBABAC: the shortest edit script has D = 5.
    const diff = textDiff(asLines('ABCABBA'), asLines('CBABAC'));
    expect(diff.removed + diff.added).toBe(5);
    expect(diff.removed).toBe(3);
    expect(diff.added).toBe(2);
    // The same example through the package's array diff, as a cross-check of the engine.
    const edits = diffArrays('ABCABBA'.split(''), 'CBABAC'.split(''))
      .filter((part) => part.added || part.removed)
      .reduce((sum, part) => sum + part.count, 0);
    expect(edits).toBe(5); // [myers-1986]
  });

  it('lays out rows for a side-by-side view with both line numbers', () => {
    const diff = textDiff('a\nb\nc\nd\n', 'a\nB\nc\nd\ne\n');
    expect(diff.rows).toEqual([
      { kind: 'same', left: { line: 1, text: 'a' }, right: { line: 1, text: 'a' } },
      { kind: 'changed', left: { line: 2, text: 'b' }, right: { line: 2, text: 'B' } },
      { kind: 'same', left: { line: 3, text: 'c' }, right: { line: 3, text: 'c' } },
      { kind: 'same', left: { line: 4, text: 'd' }, right: { line: 4, text: 'd' } },
      { kind: 'added', left: null, right: { line: 5, text: 'e' } },
    ]);
    expect(diff.hunks).toEqual([{ start: 0, end: 5 }]);
  });

  it('keeps unchanged stretches outside the hunks so a view can collapse them', () => {
    const { before, after } = loadPair('failsafe-fix');
    const diff = textDiff(before.text, after.text);
    const changedRows = diff.rows.filter((row) => row.kind !== 'same');
    // The header comment and the one failsafe line differ.
    expect(changedRows.some((row) => row.left?.text.includes('failsafe: 988') && row.right?.text.includes('failsafe: 1500'))).toBe(true);
    expect(diff.hunks.length).toBe(2);
    const covered = diff.hunks.reduce((sum, hunk) => sum + hunk.end - hunk.start, 0);
    expect(covered).toBeLessThan(diff.rows.length / 4);
    for (const [index, row] of diff.rows.entries()) {
      if (row.kind !== 'same') expect(diff.hunks.some((hunk) => hunk.start <= index && index < hunk.end)).toBe(true);
    }
    // Every line of each text appears once, in order, on its side.
    expect(diff.rows.flatMap((row) => (row.left ? [row.left.text] : []))).toEqual(before.text.split('\n').slice(0, -1));
    expect(diff.rows.flatMap((row) => (row.right ? [row.right.text] : []))).toEqual(after.text.split('\n').slice(0, -1));
  });

  it('handles empty texts and a missing final newline', () => {
    expect(textDiff('', '')).toEqual({ rows: [], hunks: [], removed: 0, added: 0 });
    const diff = textDiff('a\nb', 'a\nb\n');
    expect(diff.rows.map((row) => row.kind)).toEqual(['same', 'changed']);
  });
});
