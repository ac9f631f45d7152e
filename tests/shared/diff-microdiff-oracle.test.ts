import diff from 'microdiff';
import { describe, expect, it } from 'vitest';
import { diffSetups } from '@shared/diff';
import { LIST_KEYS, MAP_KEY } from '@shared/diff/identity';
import { loadPair, type PairName } from './diff-pairs';

// The semantic diff against an independent deep-diff, npm `microdiff`, run over the
// documents with every identity-keyed list turned into a map by its key: both must
// find the same changed paths. Pairs with renames or moves are left out, since a
// plain deep diff sees a rename as a removal and an addition.

function keyed(data: unknown): unknown {
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
        return [String(item[key]), item];
      }),
    );
  }
  return doc;
}

/** microdiff's path written as the semantic diff writes it; a scalar list counts as one value. */
function semantic(path: (string | number)[]): string {
  let out = '';
  for (let i = 0; i < path.length; i += 1) {
    const step = String(path[i]);
    const parent = i > 0 ? String(path[i - 1]) : '';
    if (i > 0 && i === 1 && LIST_KEYS[parent]) out += `[${LIST_KEYS[parent]}=${step}]`;
    else if (parent === 'map' && i === 3) out += `[pin=${step}]`;
    else if (typeof path[i] === 'number') break;
    else out += out === '' ? step : `.${step}`;
  }
  return out;
}

const PAIRS: PairName[] = ['failsafe-fix', 'trim-tuning', 'receiver-added', 'remap-second-receiver'];

describe.each(PAIRS)('the semantic diff of %s against microdiff', (name) => {
  it('finds the same changed paths', () => {
    const { before, after } = loadPair(name);
    const ours = new Set(diffSetups(before.data, after.data).changes.map((change) => change.path));
    const theirs = new Set(
      diff(keyed(before.data) as object, keyed(after.data) as object).map((d) => semantic(d.path)),
    );
    expect([...ours].sort()).toEqual([...theirs].sort());
  });
});
