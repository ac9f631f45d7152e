import { parse, parseDocument } from 'yaml';
import { applyEdits, UnreadableTextError, type DocumentEdit, type YamlPath } from '../edit/document-edits';
import { listKeyAt, matchList } from '../diff/identity';
import { deepEqual, isPlainObject } from '../diff/plain';

// The edits that turn `before` (the value at `path`) into `after`, in the order they
// are to be applied: list indexes name the list as the earlier edits have left it.
function editsBetween(path: YamlPath, before: unknown, after: unknown): DocumentEdit[] {
  if (deepEqual(before, after)) return [];
  if (isPlainObject(before) && isPlainObject(after)) {
    const edits: DocumentEdit[] = Object.keys(before)
      .filter((key) => !Object.hasOwn(after, key))
      .map((key) => ({ kind: 'delete', path: [...path, key] }));
    for (const [key, value] of Object.entries(after)) {
      if (!Object.hasOwn(before, key)) edits.push({ kind: 'set', path: [...path, key], value });
      else edits.push(...editsBetween([...path, key], before[key], value));
    }
    return edits;
  }
  if (Array.isArray(before) && Array.isArray(after)) return listEdits(path, before, after);
  return [{ kind: 'set', path, value: after }];
}

// The positions j whose before-index `paired[j]` form a longest increasing run: those
// entries can stay where they are written; any other paired entry has moved.
function staying(paired: readonly (number | undefined)[]): Set<number> {
  const length: number[] = [];
  const previous: (number | undefined)[] = [];
  let best: number | undefined;
  paired.forEach((i, j) => {
    if (i === undefined) return;
    length[j] = 1;
    for (let k = 0; k < j; k += 1) {
      const before = paired[k];
      if (before !== undefined && before < i && length[k] + 1 > length[j]) {
        length[j] = length[k] + 1;
        previous[j] = k;
      }
    }
    if (best === undefined || length[j] > length[best]) best = j;
  });
  const run = new Set<number>();
  for (let j = best; j !== undefined; j = previous[j]) run.add(j);
  return run;
}

// A list is edited entry by entry: entries are paired by identity key as the merge pairs
// them (by position in a list without one), so a changed entry keeps its own line and
// comment, a removed one loses its line and a new one gets a line of its own where the
// merge put it. An entry that changed places (rare: the merge keeps the fork's order) is
// written anew where it now is.
function listEdits(path: YamlPath, before: unknown[], after: unknown[]): DocumentEdit[] {
  const listKey = listKeyAt(path);
  const pairs = listKey
    ? matchList(before, after, listKey, new WeakMap(), 'e').rightToLeft
    : new Map(after.slice(0, before.length).map((_, index) => [index, index]));
  const paired = after.map((_, j) => pairs.get(j));
  const stay = staying(paired);
  const kept = new Set([...stay].map((j) => paired[j]));

  const edits: DocumentEdit[] = [];
  for (let i = before.length - 1; i >= 0; i -= 1) if (!kept.has(i)) edits.push({ kind: 'delete', path: [...path, i] });
  after.forEach((value, j) => {
    const i = paired[j];
    if (i === undefined || !stay.has(j)) edits.push({ kind: 'insert', path: [...path, j], value });
    else edits.push(...editsBetween([...path, j], before[i], value));
  });
  return edits;
}

/**
 * The text of `after`, written as edits to `text` (whose plain value is `before`):
 * only the changed values, keys and list entries are touched, so comments, key order,
 * alignment and flow style of everything else stay byte for byte as the author wrote
 * them (the edits of shared/edit). Falls back to a fresh rendering only if the text
 * cannot be read or the edited text would not read back as `after`.
 */
export function applyToText(text: string, before: unknown, after: unknown): string {
  if (isPlainObject(before) && isPlainObject(after)) {
    try {
      const written = applyEdits(text, editsBetween([], before, after));
      if (deepEqual(parse(written), after)) return written;
    } catch (error) {
      if (!(error instanceof UnreadableTextError)) throw error;
    }
  }
  const fresh = parseDocument('');
  fresh.contents = fresh.createNode(after) as typeof fresh.contents;
  return fresh.toString();
}
