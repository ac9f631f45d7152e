import { deepEqual, isPlainObject, withoutKey } from './plain';

// The identity keys of docs/format.md: list entries are matched between revisions by
// these, never by their position in the list. A key of several fields is written with
// commas (`rule,path`): an accepted finding is the rule and the path together.
export const LIST_KEYS: Readonly<Record<string, string>> = {
  controls: 'id',
  channels: 'ch',
  mixes: 'id',
  receivers: 'id',
  accepted: 'rule,path',
};
export const MAP_KEY = 'pin';

/**
 * The identity key of the list at `listPath` (keys, and list entries by their
 * position): a top-level list's from LIST_KEYS, `pin` for a receiver's pin map, and
 * undefined for any other list, whose entries are matched by position.
 */
export function listKeyAt(listPath: readonly (string | number)[]): string | undefined {
  const [list, entry, field] = listPath;
  // Own keys only: `constructor` or `toString` at the top of a document is a list without a key.
  if (listPath.length === 1 && typeof list === 'string')
    return Object.hasOwn(LIST_KEYS, list) ? LIST_KEYS[list] : undefined;
  return listPath.length === 3 && list === 'receivers' && typeof entry === 'number' && field === 'map'
    ? MAP_KEY
    : undefined;
}

/** The fields of an identity key: one, or several for a composite key such as `rule,path`. */
export const keyFields = (key: string): string[] => key.split(',');

// The order of these lists means nothing at all (not even the order pins are listed
// in), so reordering them is no change, not even a `moved` one.
export const UNORDERED_LISTS: ReadonlySet<string> = new Set(['accepted']);

// Two channel-plan entries on one `ch` are an error (channel-shared) but happen while
// editing; among such duplicates the function tells which is which.
const SECONDARY_KEYS: Readonly<Record<string, string>> = { ch: 'function' };

function scalarText(value: unknown): string | undefined {
  if (typeof value === 'string' || typeof value === 'number' || typeof value === 'boolean') return String(value);
  return undefined;
}

/**
 * An entry's identity as text: the key field's value, or for a composite key every
 * field as `field=value` joined by commas (`rule=failsafe-unset,path=...`), which is
 * also how its path segment is written. Undefined when a field is missing or not a scalar.
 */
export function identityValue(item: unknown, key: string): string | undefined {
  if (!isPlainObject(item)) return undefined;
  // One field (every key but `accepted`'s) without splitting the key for each entry.
  if (!key.includes(',')) return scalarText(item[key]);
  const parts: string[] = [];
  for (const field of keyFields(key)) {
    const value = scalarText(item[field]);
    if (value === undefined) return undefined;
    parts.push(`${field}=${value}`);
  }
  return parts.join(',');
}

export interface ListMatch {
  key: string;
  /** Path segment of each entry, e.g. `[id=wing]`, `[ch=8#2]` for a duplicate key, `[3]` without a key. */
  leftSegments: string[];
  rightSegments: string[];
  /** Short names of the entries for sentences: the key value, or `#n` without one. */
  leftLabels: string[];
  rightLabels: string[];
  rightToLeft: Map<number, number>;
  /** Right indexes of entries paired with a left entry whose key differs but whose other content is equal. */
  renamed: Set<number>;
  /** Right indexes of entries paired with an equal left entry (same key, same content). */
  equal: Set<number>;
}

/** The path segment and short name of each entry of an identity-keyed list, in list order. */
export function segments(
  items: readonly unknown[],
  key: string,
  values: readonly (string | undefined)[] = items.map((item) => identityValue(item, key)),
): { segments: string[]; labels: string[] } {
  const composite = keyFields(key).length > 1;
  const total = new Map<string, number>();
  for (const value of values) if (value !== undefined) total.set(value, (total.get(value) ?? 0) + 1);
  const seen = new Map<string, number>();
  const result: string[] = [];
  const labels: string[] = [];
  values.forEach((value, index) => {
    if (value === undefined) {
      result.push(`[${index}]`);
      labels.push(`#${index + 1}`);
      return;
    }
    const occurrence = (seen.get(value) ?? 0) + 1;
    seen.set(value, occurrence);
    const suffix = (total.get(value) ?? 0) > 1 ? `#${occurrence}` : '';
    result.push(composite ? `[${value}${suffix}]` : `[${key}=${value}${suffix}]`);
    labels.push(`${value}${suffix}`);
  });
  return { segments: result, labels };
}

// Pairs the entries of one list on both sides and gives every paired object one
// token, which jsondiffpatch's objectHash then reads; unpaired objects get a token of
// their own. Pairing order: same key and same content, same key and same secondary
// key, same key in order of appearance, then renames (different key, same content),
// and last entries without a usable key that are equal.
export function matchList(
  left: readonly unknown[],
  right: readonly unknown[],
  key: string,
  tokens: WeakMap<object, string>,
  prefix: string,
): ListMatch {
  const leftKeys = left.map((item) => identityValue(item, key));
  const rightKeys = right.map((item) => identityValue(item, key));
  const leftFree = new Set(left.map((_, index) => index).filter((index) => isPlainObject(left[index])));
  const rightFree = new Set(right.map((_, index) => index).filter((index) => isPlainObject(right[index])));
  const rightToLeft = new Map<number, number>();
  const renamed = new Set<number>();
  const equal = new Set<number>();

  const pair = (i: number, j: number): void => {
    rightToLeft.set(j, i);
    leftFree.delete(i);
    rightFree.delete(j);
  };
  // Candidates on the left for a right entry: those with the same key (looked up, so a
  // 300-mix stress setup stays fast), or every free one for the key-less passes.
  const leftByKey = new Map<string, number[]>();
  leftKeys.forEach((value, index) => {
    if (value === undefined || !leftFree.has(index)) return;
    const same = leftByKey.get(value);
    if (same) same.push(index);
    else leftByKey.set(value, [index]);
  });
  const pairWhere = (
    candidates: (j: number) => Iterable<number>,
    accept: (i: number, j: number) => boolean,
    rename = false,
  ): void => {
    for (const j of [...rightFree]) {
      for (const i of candidates(j)) {
        if (leftFree.has(i) && accept(i, j)) {
          pair(i, j);
          if (rename) renamed.add(j);
          break;
        }
      }
    }
  };
  const sameKey = (j: number): number[] => {
    const value = rightKeys[j];
    return value === undefined ? [] : (leftByKey.get(value) ?? []);
  };
  const anyFree = (): Iterable<number> => [...leftFree];
  const secondary = SECONDARY_KEYS[key];
  const composite = keyFields(key).length > 1;

  pairWhere(sameKey, (i, j) => deepEqual(left[i], right[j]));
  for (const j of rightToLeft.keys()) equal.add(j);
  if (secondary) {
    pairWhere(sameKey, (i, j) => {
      const a = identityValue(left[i], secondary);
      return a !== undefined && a === identityValue(right[j], secondary);
    });
  }
  pairWhere(sameKey, () => true);
  // A composite key is the whole identity (an accepted finding that names another rule
  // or path accepts something else), so such entries are never paired as renamed.
  pairWhere(
    anyFree,
    (i, j) =>
      !composite &&
      leftKeys[i] !== undefined &&
      rightKeys[j] !== undefined &&
      deepEqual(
        withoutKey(left[i] as Record<string, unknown>, key),
        withoutKey(right[j] as Record<string, unknown>, key),
      ),
    true,
  );
  pairWhere(anyFree, (i, j) => leftKeys[i] === undefined && rightKeys[j] === undefined && deepEqual(left[i], right[j]));

  for (const [j, i] of rightToLeft) {
    const token = `${prefix}=${i}:${j}`;
    tokens.set(left[i] as object, token);
    tokens.set(right[j] as object, token);
  }
  for (const i of leftFree) tokens.set(left[i] as object, `${prefix}<${i}`);
  for (const j of rightFree) tokens.set(right[j] as object, `${prefix}>${j}`);

  const leftNames = segments(left, key, leftKeys);
  const rightNames = segments(right, key, rightKeys);
  return {
    key,
    leftSegments: leftNames.segments,
    rightSegments: rightNames.segments,
    leftLabels: leftNames.labels,
    rightLabels: rightNames.labels,
    rightToLeft,
    renamed,
    equal,
  };
}
