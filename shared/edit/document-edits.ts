import {
  isMap,
  isScalar,
  isSeq,
  parseDocument,
  stringify,
  type Document,
  type Node,
  type Pair,
  type YAMLMap,
  type YAMLSeq,
} from 'yaml';
import { plainText } from '../parse/plain-text';

// Form edits on the setup text. Each edit is applied through the yaml package's
// Document API, which defines what the result means. The text is then changed only
// where the edit lands (one value, one key, one list item), so the pilot's comments,
// alignment and flow style elsewhere stay as written. A splice whose result does not
// read back as exactly the Document API's result is dropped for the Document's own
// serialisation: the meaning is never traded for the layout.

export type YamlPath = readonly (string | number)[];

export type DocumentEdit =
  /** Sets a map key or a list item, adding the key when the map lacks it. */
  | { kind: 'set'; path: YamlPath; value: unknown }
  /** Removes a map key or a list item; a missing one is no change. */
  | { kind: 'delete'; path: YamlPath }
  /** Adds an item at the end of the list at `path`, creating the list when the key is missing. */
  | { kind: 'append'; path: YamlPath; value: unknown }
  /** Puts an item into a list before the item at `path` (a list index); at the list's end it appends. */
  | { kind: 'insert'; path: YamlPath; value: unknown };

export class UnreadableTextError extends Error {
  constructor() {
    super('The text has YAML syntax errors, so the forms cannot change it. Fix them in the text first.');
    this.name = 'UnreadableTextError';
  }
}

const SERIALISE = { lineWidth: 0, flowCollectionPadding: true } as const;

function parse(text: string): Document.Parsed {
  return parseDocument(text, { uniqueKeys: true });
}

/** The plain value of a readable setup text, or null when the YAML has errors. */
export function readDocumentData(text: string): unknown {
  const doc = parse(text);
  return doc.errors.length > 0 ? null : doc.toJS();
}

/** Applies the edits in order and answers the new text. */
export function applyEdits(text: string, edits: readonly DocumentEdit[]): string {
  return edits.reduce(applyEdit, text);
}

function applyEdit(text: string, edit: DocumentEdit): string {
  const doc = parse(text);
  if (doc.errors.length > 0) throw new UnreadableTextError();

  const expected = doc.clone();
  applyToDocument(expected, edit);
  const wanted: unknown = expected.toJS();

  const spliced = splice(text, doc, edit);
  if (spliced !== null) {
    const check = parse(spliced);
    if (check.errors.length === 0 && deepEqual(check.toJS(), wanted)) return spliced;
  }
  return expected.toString(SERIALISE);
}

// What an edit means, said with the Document API.
function applyToDocument(doc: Document, edit: DocumentEdit): void {
  if (edit.kind === 'set') doc.setIn(edit.path, edit.value);
  else if (edit.kind === 'delete') doc.deleteIn(edit.path);
  else if (edit.kind === 'insert') {
    const list = nodeAt(doc, edit.path.slice(0, -1));
    const index = edit.path[edit.path.length - 1];
    if (isSeq(list) && typeof index === 'number' && index <= list.items.length)
      list.items.splice(index, 0, doc.createNode(edit.value));
    else doc.setIn(edit.path, edit.value);
  } else if (doc.hasIn(edit.path)) doc.addIn(edit.path, edit.value);
  else doc.setIn(edit.path, [edit.value]);
}

// ---- where an edit lands in the text

function nodeAt(doc: Document, path: YamlPath): unknown {
  return path.length === 0 ? doc.contents : doc.getIn(path, true);
}

function keyOf(pair: Pair): unknown {
  return isScalar(pair.key) ? pair.key.value : pair.key;
}

function rangeOf(node: unknown): [number, number, number] | null {
  const range = (node as Node | null)?.range;
  return range ? [range[0], range[1], range[2]] : null;
}

function splice(text: string, doc: Document.Parsed, edit: DocumentEdit): string | null {
  if (edit.path.length === 0) return null;
  const key = edit.path[edit.path.length - 1];
  const parentPath = edit.path.slice(0, -1);
  const parent = nodeAt(doc, parentPath);

  if (edit.kind === 'append') {
    const list = nodeAt(doc, edit.path);
    if (isSeq(list)) return appendItem(text, list, edit.value);
    if (list === undefined && isMap(parent)) return insertPair(text, parent, key, [edit.value]);
    return null;
  }

  if (isMap(parent)) {
    const pair = parent.items.find((item) => keyOf(item) === key);
    if (edit.kind === 'set')
      return pair ? replaceNode(text, pair.value, edit.value) : insertPair(text, parent, key, edit.value);
    return pair ? removePair(text, parent, pair) : text;
  }
  if (isSeq(parent) && typeof key === 'number') {
    if (edit.kind === 'insert')
      return key < parent.items.length
        ? insertItem(text, parent, key, edit.value)
        : appendItem(text, parent, edit.value);
    if (edit.kind === 'set') {
      if (key < parent.items.length) return replaceNode(text, parent.items[key], edit.value);
      return key === parent.items.length ? appendItem(text, parent, edit.value) : null;
    }
    if (key >= parent.items.length) return text;
    const owner = parentPath.length > 0 ? nodeAt(doc, parentPath.slice(0, -1)) : null;
    const ownerPair = isMap(owner)
      ? owner.items.find((item) => keyOf(item) === parentPath[parentPath.length - 1])
      : undefined;
    return removeItem(text, parent, key, ownerPair);
  }
  return null;
}

// ---- text helpers

const lineStart = (text: string, offset: number): number => text.lastIndexOf('\n', offset - 1) + 1;

/** The offset just after the line on which `offset` (an end offset) lies. */
function afterLine(text: string, end: number): number {
  if (end > 0 && text[end - 1] === '\n') return end;
  const newline = text.indexOf('\n', end);
  return newline === -1 ? text.length : newline + 1;
}

/** Inserts whole lines at `at`, which is a line start or the end of the text. */
function insertLines(text: string, at: number, lines: string): string {
  const lead = at === text.length && text.length > 0 && !text.endsWith('\n') ? '\n' : '';
  return text.slice(0, at) + lead + lines + text.slice(at);
}

const onlySpaces = (part: string): boolean => /^[ \t]*$/.test(part);

// ---- rendering values in the format's usual shape: scalars plain where YAML allows,
// collections in flow style, as the pilots' files write their list entries

function renderScalar(value: unknown, inFlow: boolean): string {
  if (value === null || value === undefined) return 'null';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : stringify(value).trim();
  if (typeof value === 'boolean') return String(value);
  const text = plainText(value);
  const plain = stringify(text, { lineWidth: 0 }).replace(/\n$/, '');
  if (plain.includes('\n') || (inFlow && /[,[\]{}]/.test(plain) && !/^["']/.test(plain))) return JSON.stringify(text);
  return plain;
}

function renderFlow(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(renderFlow).join(', ')}]`;
  if (value !== null && typeof value === 'object') {
    const entries = Object.entries(value).filter(([, item]) => item !== undefined);
    if (entries.length === 0) return '{}';
    return `{ ${entries.map(([key, item]) => `${renderScalar(key, true)}: ${renderFlow(item)}`).join(', ')} }`;
  }
  return renderScalar(value, true);
}

const isObject = (value: unknown): value is Record<string, unknown> =>
  value !== null && typeof value === 'object' && !Array.isArray(value);

// ---- the splices

function replaceNode(text: string, node: unknown, value: unknown): string | null {
  const range = rangeOf(node);
  if (!range) return null;
  // A block collection spans whole lines; replacing it is left to the serialiser.
  if ((isMap(node) || isSeq(node)) && !node.flow) return null;
  if (isScalar(node) && node.source === undefined && node.value === null && range[0] === range[1]) return null;
  return text.slice(0, range[0]) + renderFlow(value) + text.slice(range[1]);
}

/** Adds an entry before a flow collection's closing bracket, keeping its spacing. */
function insertInFlow(text: string, collection: YAMLMap | YAMLSeq, entry: string): string | null {
  const range = rangeOf(collection);
  if (!range) return null;
  const close = range[1] - 1;
  if (text[close] !== '}' && text[close] !== ']') return null;
  if (collection.items.length === 0) {
    const padded = text[close] === '}' ? `{ ${entry} }` : `[${entry}]`;
    return text.slice(0, range[0]) + padded + text.slice(range[1]);
  }
  let at = close;
  while (at > range[0] && /\s/.test(text[at - 1])) at -= 1;
  const joiner = text[at - 1] === ',' ? ' ' : ', ';
  return text.slice(0, at) + joiner + entry + text.slice(at);
}

function insertPair(text: string, map: YAMLMap, key: string | number, value: unknown): string | null {
  if (typeof key !== 'string') return null;
  if (map.flow) return insertInFlow(text, map, `${renderScalar(key, true)}: ${renderFlow(value)}`);
  const first = map.items[0];
  const last = map.items[map.items.length - 1];
  const firstKey = rangeOf(first?.key);
  const lastEnd = rangeOf(last?.value ?? last?.key);
  if (!firstKey || !lastEnd) return null;
  const indent = ' '.repeat(firstKey[0] - lineStart(text, firstKey[0]));
  const at = afterLine(text, lastEnd[2]);
  const head = `${indent}${renderScalar(key, false)}:`;
  if (Array.isArray(value) && value.length > 0 && value.every(isObject)) {
    const items = value.map((item) => `${indent}  - ${renderFlow(item)}\n`).join('');
    return insertLines(text, at, `${head}\n${items}`);
  }
  return insertLines(text, at, `${head} ${renderFlow(value)}\n`);
}

/** The span of one entry of a flow collection with its separating comma. */
function flowEntrySpan(text: string, start: number, end: number, open: number): [number, number] {
  let after = end;
  while (/[ \t]/.test(text[after] ?? '')) after += 1;
  if (text[after] === ',') {
    after += 1;
    while (/[ \t]/.test(text[after] ?? '')) after += 1;
    return [start, after];
  }
  let before = start;
  while (before > open && /[ \t]/.test(text[before - 1])) before -= 1;
  if (text[before - 1] === ',') return [before - 1, end];
  return [start, end];
}

function removePair(text: string, map: YAMLMap, pair: Pair): string | null {
  const keyRange = rangeOf(pair.key);
  const end = rangeOf(pair.value ?? pair.key);
  const own = rangeOf(map);
  if (!keyRange || !end || !own) return null;
  if (map.flow) {
    const [from, to] = flowEntrySpan(text, keyRange[0], end[1], own[0] + 1);
    return text.slice(0, from) + text.slice(to);
  }
  if (map.items.length === 1) return null;
  const start = lineStart(text, keyRange[0]);
  // The first key of a list item shares its line with the item's dash.
  if (!onlySpaces(text.slice(start, keyRange[0]))) return null;
  return text.slice(0, start) + text.slice(afterLine(text, end[2]));
}

function appendItem(text: string, seq: YAMLSeq, value: unknown): string | null {
  if (seq.flow) return insertInFlow(text, seq, renderFlow(value));
  const last = rangeOf(seq.items[seq.items.length - 1]);
  const lines = blockItemLines(text, seq, seq.items[seq.items.length - 1], value);
  return last && lines ? insertLines(text, afterLine(text, last[2]), lines) : null;
}

/** Puts an item before the item at `index`: after the line where the previous item ends, so a comment above the next item stays with it. */
function insertItem(text: string, seq: YAMLSeq, index: number, value: unknown): string | null {
  const next = rangeOf(seq.items[index]);
  if (!next) return null;
  if (seq.flow) return `${text.slice(0, next[0])}${renderFlow(value)}, ${text.slice(next[0])}`;
  const previous = index > 0 ? rangeOf(seq.items[index - 1]) : null;
  const at = previous ? afterLine(text, previous[2]) : lineStart(text, next[0]);
  const lines = blockItemLines(text, seq, seq.items[index], value);
  return lines ? insertLines(text, at, lines) : null;
}

/** The lines of a new item of a block list, at its items' indentation and in the style of `neighbour`. */
function blockItemLines(text: string, seq: YAMLSeq, neighbour: unknown, value: unknown): string | null {
  const first = rangeOf(seq.items[0]);
  if (!first) return null;
  const start = lineStart(text, first[0]);
  const dash = text.indexOf('-', start);
  if (dash < 0 || dash >= first[0] || !onlySpaces(text.slice(start, dash))) return null;
  const indent = ' '.repeat(dash - start);
  if (isMap(neighbour) && !neighbour.flow && isObject(value)) {
    const keyIndent = ' '.repeat(first[0] - start);
    const lines = Object.entries(value)
      .filter(([, item]) => item !== undefined)
      .map(
        ([key, item], index) =>
          `${index === 0 ? `${indent}- ` : keyIndent}${renderScalar(key, false)}: ${renderFlow(item)}\n`,
      )
      .join('');
    return lines || null;
  }
  return `${indent}- ${renderFlow(value)}\n`;
}

function removeItem(text: string, seq: YAMLSeq, index: number, ownerPair: Pair | undefined): string | null {
  const item = rangeOf(seq.items[index]);
  const own = rangeOf(seq);
  if (!item || !own) return null;
  if (seq.flow) {
    const [from, to] = flowEntrySpan(text, item[0], item[1], own[0] + 1);
    return text.slice(0, from) + text.slice(to);
  }
  const start = lineStart(text, item[0]);
  if (!/^[ \t]*-[ \t]*$/.test(text.slice(start, item[0]))) return null;
  const removed = text.slice(0, start) + text.slice(afterLine(text, item[2]));
  if (seq.items.length > 1) return removed;
  // The last item gone, the key keeps an empty list rather than turning null.
  const keyRange = rangeOf(ownerPair?.key);
  if (!keyRange) return null;
  const colon = text.indexOf(':', keyRange[1]);
  if (colon < 0 || colon >= start) return null;
  return `${removed.slice(0, colon + 1)} []${removed.slice(colon + 1)}`;
}

// ---- comparing plain values: key order of maps does not matter, list order does

function deepEqual(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (Array.isArray(a) || Array.isArray(b)) {
    if (!Array.isArray(a) || !Array.isArray(b) || a.length !== b.length) return false;
    return a.every((item, index) => deepEqual(item, b[index]));
  }
  if (isObject(a) && isObject(b)) {
    const keys = Object.keys(a);
    if (keys.length !== Object.keys(b).length) return false;
    return keys.every((key) => Object.hasOwn(b, key) && deepEqual(a[key], b[key]));
  }
  return Number.isNaN(a) && Number.isNaN(b);
}
