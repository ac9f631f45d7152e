import { listKeyAt, matchList, segments } from '../diff/identity';
import { deepEqual, isPlainObject, setOwn, type PlainObject } from '../diff/plain';

export type MergeSide = 'ours' | 'theirs';

/** One path both sides changed differently; null stands for "not there" on that side. */
export interface MergeConflict {
  path: string;
  base: unknown;
  ours: unknown;
  theirs: unknown;
}

export interface MergeResult {
  /** The merged document; at a conflict left unresolved it holds ours. */
  data: unknown;
  conflicts: MergeConflict[];
}

// "Not there": a key absent from an object, an entry absent from a list.
const ABSENT: unique symbol = Symbol('absent');
type Value = unknown;

const orNull = (value: Value): unknown => (value === ABSENT ? null : value);
const same = (a: Value, b: Value): boolean => (a === ABSENT || b === ABSENT ? a === b : deepEqual(a, b));

class Merger {
  readonly conflicts: MergeConflict[] = [];

  constructor(private readonly resolutions: Readonly<Record<string, MergeSide>>) {}

  // `path` names the value by identity; `place` is where it is as keys and list positions
  // (ours' where ours has the entry), which tells a list's identity key.
  value(base: Value, ours: Value, theirs: Value, path: string, place: readonly (string | number)[]): Value {
    if (same(ours, theirs)) return ours;
    if (same(base, ours)) return theirs;
    if (same(base, theirs)) return ours;
    const baseOrEmpty = (empty: unknown) => (base === ABSENT ? empty : base);
    if (isPlainObject(ours) && isPlainObject(theirs) && isPlainObject(baseOrEmpty({})))
      return this.object(baseOrEmpty({}) as PlainObject, ours, theirs, path, place);
    const listKey = listKeyAt(place);
    if (listKey && Array.isArray(ours) && Array.isArray(theirs) && Array.isArray(baseOrEmpty([])))
      return this.list(baseOrEmpty([]) as unknown[], ours, theirs, path, place, listKey);
    return this.conflict(base, ours, theirs, path);
  }

  private conflict(base: Value, ours: Value, theirs: Value, path: string): Value {
    const choice = Object.hasOwn(this.resolutions, path) ? this.resolutions[path] : undefined;
    if (choice) return choice === 'ours' ? ours : theirs;
    this.conflicts.push({ path, base: orNull(base), ours: orNull(ours), theirs: orNull(theirs) });
    return ours;
  }

  private object(
    base: PlainObject,
    ours: PlainObject,
    theirs: PlainObject,
    path: string,
    place: readonly (string | number)[],
  ): PlainObject {
    const keys = [...Object.keys(ours), ...Object.keys(theirs).filter((key) => !Object.hasOwn(ours, key))];
    const merged: PlainObject = {};
    for (const key of keys) {
      const at = (side: PlainObject): Value => (Object.hasOwn(side, key) ? side[key] : ABSENT);
      const child = path ? `${path}.${key}` : key;
      const value = this.value(at(base), at(ours), at(theirs), child, [...place, key]);
      if (value !== ABSENT) setOwn(merged, key, value);
    }
    return merged;
  }

  // Entries are matched with the base by identity key (renames included: an entry
  // whose key alone changed is the same entry), merged one by one, and kept in ours'
  // order; entries only theirs has go after the entry they follow in theirs.
  private list(
    base: unknown[],
    ours: unknown[],
    theirs: unknown[],
    path: string,
    place: readonly (string | number)[],
    key: string,
  ): unknown[] {
    const oursMatch = matchList(base, ours, key, new WeakMap(), 'o');
    const theirsMatch = matchList(base, theirs, key, new WeakMap(), 't');
    const baseNames = segments(base, key).segments;
    const oursNames = segments(ours, key).segments;
    const theirsNames = segments(theirs, key).segments;

    // An entity is one entry's life across the three sides: [base, ours, theirs] indexes.
    type Entity = { base?: number; ours?: number; theirs?: number; path: string };
    const entities: Entity[] = base.map((_, index) => ({ base: index, path: `${path}${baseNames[index]}` }));
    const oursEntity = new Map<number, Entity>();
    const theirsEntity = new Map<number, Entity>();
    for (const [j, i] of oursMatch.rightToLeft) {
      entities[i].ours = j;
      oursEntity.set(j, entities[i]);
    }
    for (const [j, i] of theirsMatch.rightToLeft) {
      entities[i].theirs = j;
      theirsEntity.set(j, entities[i]);
    }
    const addedByOurs = new Map<string, Entity>();
    ours.forEach((_, j) => {
      if (oursEntity.has(j)) return;
      const entity: Entity = { ours: j, path: `${path}${oursNames[j]}` };
      entities.push(entity);
      oursEntity.set(j, entity);
      addedByOurs.set(oursNames[j], entity);
    });
    theirs.forEach((_, j) => {
      if (theirsEntity.has(j)) return;
      // Both sides added an entry with the same key: one entry, merged field by field.
      const twin = addedByOurs.get(theirsNames[j]);
      const entity: Entity = twin ?? { path: `${path}${theirsNames[j]}` };
      entity.theirs = j;
      if (!twin) entities.push(entity);
      theirsEntity.set(j, entity);
    });

    const results = new Map<Entity, Value>();
    for (const entity of entities) {
      const pick = (list: unknown[], index: number | undefined): Value => (index === undefined ? ABSENT : list[index]);
      // Every entity is on one side at least.
      const position = entity.ours ?? entity.theirs ?? entity.base!;
      results.set(
        entity,
        this.value(pick(base, entity.base), pick(ours, entity.ours), pick(theirs, entity.theirs), entity.path, [
          ...place,
          position,
        ]),
      );
    }
    const order: Entity[] = ours.map((_, j) => oursEntity.get(j)!);
    theirs.forEach((_, j) => {
      const entity = theirsEntity.get(j)!;
      if (order.includes(entity)) return;
      let at = 0;
      for (let k = j - 1; k >= 0; k -= 1) {
        const before = order.indexOf(theirsEntity.get(k)!);
        if (before >= 0) {
          at = before + 1;
          break;
        }
      }
      order.splice(at, 0, entity);
    });
    return order.map((entity) => results.get(entity)).filter((value) => value !== ABSENT);
  }
}

/**
 * The three-way merge of setup documents by identity path (docs/format.md's identity
 * keys, as the semantic diff pairs entries): a change only one side made since `base`
 * is kept, and a path both sides changed differently is a conflict, unless
 * `resolutions` names the side to take for that path. An entry one side removed and
 * the other changed is a conflict at the entry's path. Pure, never throws.
 */
export function mergeSetups(
  base: unknown,
  ours: unknown,
  theirs: unknown,
  resolutions: Readonly<Record<string, MergeSide>> = {},
): MergeResult {
  const merger = new Merger(resolutions);
  const data = merger.value(base ?? ABSENT, ours ?? ABSENT, theirs ?? ABSENT, '', []);
  return { data: data === ABSENT ? null : data, conflicts: merger.conflicts };
}
