import { listKeyAt, segments } from '../diff/identity';
import { isPlainObject, stableStringify } from '../diff/plain';

/**
 * Every leaf setting of a setup document by its identity path, the paths the semantic
 * diff writes (`receivers[id=wing].map[pin=4].failsafe`), each with its value as
 * canonical JSON. Entries of identity-keyed lists are named by their key, so a value
 * keeps its path when entries are reordered; a list without identity keys (rates
 * weights, a switch's positions) is one leaf, as the diff reports it. Pure, never
 * throws on any plain value.
 */
export function leafValues(data: unknown): Map<string, string> {
  const leaves = new Map<string, string>();
  // `at` is the value's place as keys and list positions, which tells a list's identity key.
  const walk = (value: unknown, path: string, at: readonly (string | number)[]): void => {
    const listKey = Array.isArray(value) ? listKeyAt(at) : undefined;
    if (Array.isArray(value) && listKey) {
      const names = segments(value, listKey).segments;
      value.forEach((item, index) => walk(item, `${path}${names[index]}`, [...at, index]));
      return;
    }
    if (isPlainObject(value)) {
      const keys = Object.keys(value);
      // An empty object still says something (`rates: {}`): it is a leaf of its own.
      if (keys.length === 0 && path) leaves.set(path, '{}');
      for (const key of keys) {
        walk(value[key], path ? `${path}.${key}` : key, [...at, key]);
      }
      return;
    }
    if (path) leaves.set(path, stableStringify(value ?? null));
  };
  walk(data, '', []);
  return leaves;
}

/** The leaf paths whose value `after` sets differently from `before` (added ones included; removed ones not). */
export function changedLeafPaths(before: unknown, after: unknown): string[] {
  const old = before === undefined ? new Map<string, string>() : leafValues(before);
  const changed: string[] = [];
  for (const [path, value] of leafValues(after)) if (old.get(path) !== value) changed.push(path);
  return changed;
}

/** True when `path` is `prefix` or lies under it (`receivers[id=wing]` holds `receivers[id=wing].map[pin=1].failsafe`). */
export function isUnder(path: string, prefix: string): boolean {
  if (path === prefix) return true;
  if (!path.startsWith(prefix)) return false;
  const next = path[prefix.length];
  return next === '.' || next === '[';
}
