import { isMap, isScalar, isSeq, parse, parseDocument, type Document } from 'yaml';
import { LIST_KEYS, MAP_KEY, matchList } from '../diff/identity';
import { deepEqual, isPlainObject } from '../diff/plain';

type Edited = unknown;

// Rewrites the parts of `node` (whose plain value is `before`) that differ in `after`,
// in place where it can: a scalar keeps its comments and style, a mapping its key
// order and comments, and a list entry matched by identity key keeps its own text.
function edit(
  doc: Document,
  node: Edited,
  before: unknown,
  after: unknown,
  listKey?: string,
  inReceiver = false,
): Edited {
  if (deepEqual(before, after)) return node;
  if (isScalar(node) && !isPlainObject(after) && !Array.isArray(after)) {
    node.value = after;
    return node;
  }
  if (isMap(node) && isPlainObject(before) && isPlainObject(after)) {
    for (const key of Object.keys(before)) if (!Object.hasOwn(after, key)) node.delete(key);
    for (const [key, value] of Object.entries(after)) {
      if (!Object.hasOwn(before, key)) {
        node.set(key, doc.createNode(value));
        continue;
      }
      const nested = listKey === 'top' ? LIST_KEYS[key] : inReceiver && key === 'map' ? MAP_KEY : undefined;
      const child = node.get(key, true);
      const updated = edit(doc, child, before[key], value, nested, listKey === 'top' && key === 'receivers');
      if (updated !== child) node.set(key, updated);
    }
    return node;
  }
  if (isSeq(node) && listKey && Array.isArray(before) && Array.isArray(after)) {
    const match = matchList(before, after, listKey, new WeakMap(), 'e');
    const items = after.map((value, j) => {
      const i = match.rightToLeft.get(j);
      return i === undefined
        ? doc.createNode(value)
        : edit(doc, node.items[i], before[i], value, undefined, inReceiver);
    });
    node.items = items;
    return node;
  }
  return doc.createNode(after);
}

/**
 * The text of `after`, written as edits to `text` (whose plain value is `before`):
 * comments, key order and layout of everything the edits do not touch stay as the
 * author wrote them. Falls back to a fresh rendering only if the edited text would
 * not read back as `after`.
 */
export function applyToText(text: string, before: unknown, after: unknown): string {
  const doc = parseDocument(text, { uniqueKeys: false });
  if (doc.errors.length === 0) {
    doc.contents = edit(doc, doc.contents, before, after, 'top') as typeof doc.contents;
    const written = doc.toString();
    if (deepEqual(parse(written), after)) return written;
  }
  const fresh = parseDocument('');
  fresh.contents = fresh.createNode(after) as typeof fresh.contents;
  return fresh.toString();
}
