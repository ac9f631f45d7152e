import diff from 'microdiff';
import { LIST_KEYS, MAP_KEY } from '@shared/diff/identity';

// The independent side of the semantic diff's oracle tests: npm `microdiff`, a plain
// deep diff, run over the documents with every identity-keyed list (and every
// receiver's pin map) turned into an object keyed by its identity, so that it matches
// entries by identity as the semantic diff does, without sharing any of its code.

/** The document with identity-keyed lists as objects keyed by the identity value. */
export function keyed(data: unknown): unknown {
  const doc = structuredClone(data) as Record<string, unknown>;
  for (const [list, key] of Object.entries(LIST_KEYS)) {
    const items = doc[list];
    if (!Array.isArray(items)) continue;
    doc[list] = Object.fromEntries(
      items.map((item: Record<string, unknown>) => {
        if (list === 'receivers' && Array.isArray(item.map))
          item = {
            ...item,
            map: Object.fromEntries(item.map.map((e: Record<string, unknown>) => [String(e[MAP_KEY]), e])),
          };
        // A composite key (accepted: rule and path) names every field, as paths write it.
        const fields = key.split(',');
        const name = fields.length === 1 ? String(item[key]) : fields.map((f) => `${f}=${String(item[f])}`).join(',');
        return [name, item];
      }),
    );
  }
  return doc;
}

/** microdiff's path written as the semantic diff writes it; a scalar list counts as one value. */
export function semantic(path: (string | number)[]): string {
  let out = '';
  for (let i = 0; i < path.length; i += 1) {
    const step = String(path[i]);
    const parent = i > 0 ? String(path[i - 1]) : '';
    if (i === 1 && LIST_KEYS[parent])
      out += LIST_KEYS[parent].includes(',') ? `[${step}]` : `[${LIST_KEYS[parent]}=${step}]`;
    else if (parent === 'map' && i === 3) out += `[pin=${step}]`;
    else if (typeof path[i] === 'number') break;
    else out += out === '' ? step : `.${step}`;
  }
  return out;
}

/** The changed paths microdiff finds between two documents, sorted, each once. */
export function oraclePaths(before: unknown, after: unknown): string[] {
  return [...new Set(diff(keyed(before) as object, keyed(after) as object).map((d) => semantic(d.path)))].sort();
}
