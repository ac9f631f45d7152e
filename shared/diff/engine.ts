import { create, type Delta } from 'jsondiffpatch';
import { LIST_KEYS, MAP_KEY, matchList, type ListMatch } from './identity';
import { isPlainObject, stableStringify } from './plain';

// One jsondiffpatch instance for the whole program. Entries of identity-keyed lists
// carry a token (set by matchList just before each diff) so that jsondiffpatch pairs
// them by identity and reports order changes as moves; any other object is matched by
// its content. The tokens are one diff's: a table kept for the program's life would
// collect every compared entry until the next full collection, and setting tokens in
// it cost as much as the identity matching itself.
let tokens = new WeakMap<object, string>();

const differ = create({
  objectHash: (item: object) => tokens.get(item) ?? stableStringify(item),
  arrays: { detectMove: true },
});

export interface Matches {
  /** Top-level list name -> its match. */
  lists: Map<string, ListMatch>;
  /** Right index of a receiver -> the match of its pin map with its left counterpart's. */
  maps: Map<number, ListMatch>;
}

// Pairs the entries of every identity-keyed list of the two documents (receivers'
// pin maps inside paired receivers) and runs jsondiffpatch over them. An entry equal to
// the one it is paired with is replaced in `right` by that same object, so jsondiffpatch
// passes it by identity instead of walking it again (most of a 300-mix setup is
// unchanged by a save). Both documents must be fresh copies the caller gives up.
export function diffDocuments(left: unknown, right: unknown): { delta: Delta; matches: Matches } {
  const matches: Matches = { lists: new Map(), maps: new Map() };
  tokens = new WeakMap();
  if (isPlainObject(left) && isPlainObject(right)) {
    for (const [list, key] of Object.entries(LIST_KEYS)) {
      const a: unknown = left[list];
      const b: unknown = right[list];
      if (!Array.isArray(a) || !Array.isArray(b)) continue;
      const match = matchList(a, b, key, tokens, list);
      matches.lists.set(list, match);
      for (const [j, i] of match.rightToLeft) if (match.equal.has(j)) b[j] = a[i] as unknown;
      if (list !== 'receivers') continue;
      for (const [j, i] of match.rightToLeft) {
        const mapA = (a[i] as Record<string, unknown>).map;
        const mapB = (b[j] as Record<string, unknown>).map;
        if (Array.isArray(mapA) && Array.isArray(mapB))
          matches.maps.set(j, matchList(mapA, mapB, MAP_KEY, tokens, `map${j}`));
      }
    }
  }
  return { delta: differ.diff(left, right), matches };
}
