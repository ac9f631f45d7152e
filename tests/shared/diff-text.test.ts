import { diffArrays } from 'diff';
import { describe, expect, it } from 'vitest';
import { textDiff } from '@shared/diff';
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
    expect(
      changedRows.some((row) => row.left?.text.includes('failsafe: 988') && row.right?.text.includes('failsafe: 1500')),
    ).toBe(true);
    expect(diff.hunks.length).toBe(2);
    const covered = diff.hunks.reduce((sum, hunk) => sum + hunk.end - hunk.start, 0);
    expect(covered).toBeLessThan(diff.rows.length / 4);
    for (const [index, row] of diff.rows.entries()) {
      if (row.kind !== 'same') expect(diff.hunks.some((hunk) => hunk.start <= index && index < hunk.end)).toBe(true);
    }
    // Every line of each text appears once, in order, on its side.
    expect(diff.rows.flatMap((row) => (row.left ? [row.left.text] : []))).toEqual(before.text.split('\n').slice(0, -1));
    expect(diff.rows.flatMap((row) => (row.right ? [row.right.text] : []))).toEqual(
      after.text.split('\n').slice(0, -1),
    );
  });

  it('falls back to one changed block, keeping the common start and end, when the texts differ too much', () => {
    const many = (prefix: string) => Array.from({ length: 600 }, (_, i) => `${prefix}${i}\n`).join('');
    const before = `format: bindery-setup/1\n${many('a')}end\n`;
    const after = `format: bindery-setup/1\n${many('b')}end\n`;
    const diff = textDiff(before, after);
    expect(diff.exact).toBe(false);
    expect(diff.removed).toBe(600);
    expect(diff.added).toBe(600);
    expect(diff.rows[0].kind).toBe('same');
    expect(diff.rows[diff.rows.length - 1]).toEqual({
      kind: 'same',
      left: { line: 602, text: 'end' },
      right: { line: 602, text: 'end' },
    });
    expect(diff.rows.filter((row) => row.kind === 'changed')).toHaveLength(600);
    expect(textDiff(asLines('ABCABBA'), asLines('CBABAC')).exact).toBe(true);
  });

  it('handles empty texts and a missing final newline', () => {
    expect(textDiff('', '')).toEqual({ rows: [], hunks: [], removed: 0, added: 0, exact: true });
    const diff = textDiff('a\nb', 'a\nb\n');
    expect(diff.rows.map((row) => row.kind)).toEqual(['same', 'changed']);
  });
});
