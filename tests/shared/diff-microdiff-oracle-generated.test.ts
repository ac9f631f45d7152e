import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyzeSetup } from '@shared/analyze';
import { diffSetups } from '@shared/diff';
import { LIST_KEYS, MAP_KEY } from '@shared/diff/identity';
import { setupSchema } from '@shared/format/schema';
import { oraclePaths } from './microdiff-oracle';

// The semantic diff against microdiff over identity-keyed maps (microdiff-oracle.ts)
// on generated pairs: a valid fixture, then a random series of edits a pilot makes
// (numbers nudged, switches flipped, entries removed, entries added under a new key,
// lists reordered, pins remapped). Both sides are the schema's parsed form, defaults
// written out, which is the form the semantic diff compares (with-defaults.ts), so
// both must find the same changed leaf paths. Moves are left out of ours (a keyed map
// has no order), and pairs the semantic diff reads as a rename (an added entry equal,
// but for its key, to a removed one) are skipped: a plain deep diff sees a removal and
// an addition there.

const BASES = [
  'scale-16-channel-two-receivers',
  'every-field',
  'glider-six-wing-servos',
  'helicopter-fuel-collective-gyro',
].map((name) => {
  const text = readFileSync(fileURLToPath(new URL(`../../fixtures/valid/${name}.yaml`, import.meta.url)), 'utf8');
  return setupSchema.parse(analyzeSetup(text).data);
});
// One base with accepted findings, so their composite identity (rule + path) is exercised.
BASES.push({
  ...BASES[0],
  accepted: [
    { rule: 'failsafe-unset', path: 'receivers[id=wing].map[pin=2]', reason: 'The lights may stay as they are' },
    { rule: 'control-unused', path: 'controls[id=cowl-knob]', reason: 'Kept for the next season' },
    { rule: 'telemetry-on-secondary', path: '', reason: 'Only one unit reports' },
  ],
});

type Json = Record<string, unknown>;
type Edit =
  | { kind: 'nudge'; pick: number; by: number }
  | { kind: 'remove'; list: number; pick: number }
  | { kind: 'add'; list: number; pick: number }
  | { kind: 'shuffle'; list: number; seed: number }
  | { kind: 'reword'; pick: number };

const edit: fc.Arbitrary<Edit> = fc.oneof(
  {
    weight: 4,
    arbitrary: fc.record({
      kind: fc.constant('nudge' as const),
      pick: fc.nat(),
      by: fc.integer({ min: -25, max: 25 }),
    }),
  },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('remove' as const), list: fc.nat(), pick: fc.nat() }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('add' as const), list: fc.nat(), pick: fc.nat() }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('shuffle' as const), list: fc.nat(), seed: fc.nat() }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('reword' as const), pick: fc.nat() }) },
);

const IDENTITY_FIELDS = new Set([...Object.values(LIST_KEYS).flatMap((key) => key.split(',')), MAP_KEY, 'format']);

/** Every number and boolean leaf with its holder, identity keys aside. */
function leaves(value: unknown, out: { holder: Json | unknown[]; key: string | number }[] = []) {
  if (Array.isArray(value)) {
    value.forEach((item, index) => {
      if (typeof item === 'number' || typeof item === 'boolean') out.push({ holder: value, key: index });
      else leaves(item, out);
    });
  } else if (value && typeof value === 'object') {
    for (const [key, item] of Object.entries(value as Json)) {
      if (IDENTITY_FIELDS.has(key)) continue;
      if (typeof item === 'number' || typeof item === 'boolean') out.push({ holder: value as Json, key });
      else leaves(item, out);
    }
  }
  return out;
}

/** The identity-keyed lists of a document: the four top-level lists and every pin map. */
function lists(doc: Json): { items: Json[]; key: string }[] {
  const found = Object.entries(LIST_KEYS).map(([list, key]) => ({ items: doc[list] as Json[], key }));
  for (const receiver of doc.receivers as Json[]) found.push({ items: receiver.map as Json[], key: MAP_KEY });
  return found.filter(({ items }) => Array.isArray(items));
}

/** Gives a copied entry an identity no other entry of its list has. */
function giveFreshKey(items: Json[], key: string, copy: Json): void {
  if (key.includes(',')) {
    // An accepted finding: the same rule at another path is another entry.
    let n = 2;
    while (items.some((item) => item.rule === copy.rule && item.path === `${String(copy.path)}.copy-${n}`)) n += 1;
    copy.path = `${String(copy.path)}.copy-${n}`;
    return;
  }
  copy[key] = freshKey(items, key, copy[key]);
}

function freshKey(items: Json[], key: string, from: unknown): string | number {
  const taken = new Set(items.map((item) => item[key]));
  if (typeof from === 'number') {
    let next = Math.max(0, ...items.map((item) => Number(item[key]) || 0)) + 1;
    while (taken.has(next)) next += 1;
    return next;
  }
  let n = 2;
  while (taken.has(`${String(from)}-copy-${n}`)) n += 1;
  return `${String(from)}-copy-${n}`;
}

function apply(doc: Json, change: Edit): void {
  if (change.kind === 'nudge') {
    const all = leaves(doc);
    if (all.length === 0) return;
    const { holder, key } = all[change.pick % all.length];
    const current = (holder as Record<string | number, unknown>)[key];
    (holder as Record<string | number, unknown>)[key] =
      typeof current === 'boolean' ? !current : (current as number) + (change.by === 0 ? 1 : change.by);
    return;
  }
  if (change.kind === 'reword') {
    const accepted = doc.accepted as Json[] | undefined;
    if (!accepted || accepted.length === 0) return;
    const entry = accepted[change.pick % accepted.length];
    entry.reason = `${String(entry.reason)}, looked at again`;
    return;
  }
  const every = lists(doc);
  const { items, key } = every[change.list % every.length];
  if (items.length === 0) return;
  const index = change.kind === 'shuffle' ? 0 : change.pick % items.length;
  if (change.kind === 'remove') items.splice(index, 1);
  else if (change.kind === 'add') {
    const copy = structuredClone(items[index]);
    giveFreshKey(items, key, copy);
    items.push(copy);
  } else {
    let seed = change.seed;
    for (let i = items.length - 1; i > 0; i -= 1) {
      seed = (seed * 1103515245 + 12345) % 2 ** 31;
      const j = seed % (i + 1);
      [items[i], items[j]] = [items[j], items[i]];
    }
  }
}

const pair = fc
  .record({
    base: fc.nat({ max: BASES.length - 1 }),
    edits: fc.array(edit, { minLength: 1, maxLength: 6 }),
  })
  .map(({ base, edits }) => {
    const after = structuredClone(BASES[base]);
    for (const change of edits) apply(after, change);
    return { before: BASES[base], after, edits };
  });

describe('the semantic diff against microdiff on generated pairs', () => {
  it('finds the same changed leaf paths', () => {
    let compared = 0;
    let changed = 0;
    fc.assert(
      fc.property(pair, ({ before, after }) => {
        // Both sides in the schema's form; an edit that leaves the schema (a number
        // out of its range) is not a document the diff compares in this form.
        const parsed = setupSchema.safeParse(after);
        fc.pre(parsed.success);
        const changes = diffSetups(before, after).changes;
        fc.pre(!changes.some((change) => change.kind === 'renamed'));
        const ours = [...new Set(changes.filter((c) => c.kind !== 'moved').map((c) => c.path))].sort();
        expect(ours).toEqual(oraclePaths(before, parsed.data));
        compared += 1;
        if (ours.length > 0) changed += 1;
      }),
      { numRuns: 300 },
    );
    // Most generated pairs stay valid and differ, so the property is not vacuous.
    expect(compared).toBeGreaterThan(150);
    expect(changed).toBeGreaterThan(120);
  });

  it('a reordering alone changes no path on either side, and the semantic diff says it moved', () => {
    const before = BASES[0];
    const after = structuredClone(before);
    (after.channels as Json[]).reverse();
    const changes = diffSetups(before, after).changes;
    expect(changes.map((change) => change.kind)).toEqual(['moved']);
    expect(oraclePaths(before, after)).toEqual([]);
  });
});
