// Semantic paths name a place in a setup by identity keys rather than list positions,
// e.g. `receivers[id=wing].map[pin=3].failsafe`, so they stay meaningful when lists are
// reordered. Entries without a usable identity fall back to their index: `mixes[4]`.

import { keyFields, listKeyAt } from '../diff/identity';

export type DataPath = readonly (string | number)[];

export type PathStep = { key: string } | { index: number } | { match: string; value: string };

const PLAIN_KEY = /^[A-Za-z0-9_-]+$/;

/** The identity key of the list at `listPath`, if that list has one of a single field (`[id=wing]`). */
export function identityKeyOf(listPath: DataPath): string | null {
  const key = listKeyAt(listPath);
  return key !== undefined && keyFields(key).length === 1 ? key : null;
}

function usableIdentity(value: unknown): string | null {
  if (typeof value === 'number' && Number.isFinite(value)) return String(value);
  if (typeof value === 'string' && PLAIN_KEY.test(value)) return value;
  return null;
}

function formatKey(key: string, first: boolean): string {
  if (PLAIN_KEY.test(key)) return first ? key : `.${key}`;
  return `[${JSON.stringify(key)}]`;
}

/** Turns a data path (keys and list indices) into a semantic path, reading identities from `data`. */
export function toSemanticPath(data: unknown, dataPath: DataPath): string {
  let out = '';
  let value: unknown = data;
  for (let i = 0; i < dataPath.length; i += 1) {
    const step = dataPath[i];
    if (typeof step === 'number') {
      const item: unknown = Array.isArray(value) ? value[step] : undefined;
      const key = identityKeyOf(dataPath.slice(0, i));
      const identity =
        key && item !== null && typeof item === 'object'
          ? usableIdentity((item as Record<string, unknown>)[key])
          : null;
      out += identity === null ? `[${step}]` : `[${key}=${identity}]`;
      value = item;
    } else {
      out += formatKey(step, out === '');
      value =
        value !== null && typeof value === 'object' && !Array.isArray(value)
          ? (value as Record<string, unknown>)[step]
          : undefined;
    }
  }
  return out;
}

/** Parses a semantic path; a malformed tail is ignored, so the result is its longest readable prefix. */
export function parseSemanticPath(path: string): PathStep[] {
  const steps: PathStep[] = [];
  let i = 0;
  while (i < path.length) {
    const ch = path[i];
    if (ch === '.') {
      i += 1;
    } else if (ch === '[') {
      if (path[i + 1] === '"') {
        const end = findClosingQuote(path, i + 1);
        if (end < 0 || path[end + 1] !== ']') break;
        try {
          steps.push({ key: JSON.parse(path.slice(i + 1, end + 1)) as string });
        } catch {
          break;
        }
        i = end + 2;
        continue;
      }
      const close = path.indexOf(']', i);
      if (close < 0) break;
      const inner = path.slice(i + 1, close);
      const eq = inner.indexOf('=');
      if (eq > 0) steps.push({ match: inner.slice(0, eq), value: inner.slice(eq + 1) });
      else if (/^\d+$/.test(inner)) steps.push({ index: Number(inner) });
      else break;
      i = close + 1;
    } else {
      let end = i;
      while (end < path.length && path[end] !== '.' && path[end] !== '[') end += 1;
      steps.push({ key: path.slice(i, end) });
      i = end;
    }
  }
  return steps;
}

function findClosingQuote(path: string, open: number): number {
  for (let i = open + 1; i < path.length; i += 1) {
    if (path[i] === '\\') i += 1;
    else if (path[i] === '"') return i;
  }
  return -1;
}

/** Converts a data path into steps the source locator understands. */
export function dataPathSteps(dataPath: DataPath): PathStep[] {
  return dataPath.map((step) => (typeof step === 'number' ? { index: step } : { key: step }));
}
