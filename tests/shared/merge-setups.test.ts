import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { diffLines } from 'diff';
import fc from 'fast-check';
import { parse } from 'yaml';
import { describe, expect, it } from 'vitest';
import { applyToText } from '@shared/lineage/apply-to-text';
import { leafValues } from '@shared/lineage/leaf-paths';
import { mergeSetups } from '@shared/lineage/merge-setups';

// The three-way merge by identity key. Random documents shaped like setups (mixes by
// id, receivers by id with pin maps by pin): each base entry belongs to at most one
// side, which may change or remove it, and each side may add entries of its own, so
// no path is changed by both; the merge must then equal both sides' changes applied.

interface Mix {
  id: string;
  weight: number;
  expo: number;
}
interface Pin {
  pin: number;
  failsafe: number | 'hold';
}
interface Receiver {
  id: string;
  map: Pin[];
}
interface Doc {
  model: { name: string; weight_g: number };
  mixes: Mix[];
  receivers: Receiver[];
}
interface Demo {
  channels: { cut: { value: number }; travel?: { reverse: boolean } }[];
  mixes: Record<string, unknown>[];
  receivers: { label: string; map: Pin[] }[];
}

const failsafe = fc.oneof(fc.integer({ min: 900, max: 2100 }), fc.constant('hold' as const));
const mixFields = fc.record({ weight: fc.integer({ min: -100, max: 100 }), expo: fc.integer({ min: 0, max: 100 }) });
const baseDoc: fc.Arbitrary<Doc> = fc.record({
  model: fc.record({ name: fc.constantFrom('Kestrel', 'Heron'), weight_g: fc.integer({ min: 100, max: 9000 }) }),
  mixes: fc
    .uniqueArray(fc.constantFrom('ail', 'ele', 'rud', 'thr', 'flap', 'crow'), { maxLength: 5 })
    .chain((ids) => fc.tuple(...ids.map((id) => mixFields.map((fields) => ({ id, ...fields }))))),
  receivers: fc.uniqueArray(fc.constantFrom('wing', 'tail', 'nose'), { minLength: 1, maxLength: 3 }).chain((ids) =>
    fc.tuple(
      ...ids.map((id) =>
        fc
          .uniqueArray(fc.integer({ min: 1, max: 8 }), { maxLength: 4 })
          .chain((pins) => fc.tuple(...pins.map((pin) => failsafe.map((value) => ({ pin, failsafe: value })))))
          .map((map) => ({ id, map })),
      ),
    ),
  ),
});

type Owner = 'none' | 'ours' | 'theirs';
type Act = 'keep' | 'change' | 'remove';
interface Plan {
  owner: Owner;
  act: Act;
  fields: { weight: number; expo: number };
  failsafe: number | 'hold';
}
const plan: fc.Arbitrary<Plan> = fc.record({
  owner: fc.constantFrom<Owner>('none', 'ours', 'theirs'),
  act: fc.constantFrom<Act>('keep', 'change', 'remove'),
  fields: mixFields,
  failsafe,
});

// One side's edits to `doc`: the entries of `base` it owns (each entry's plan is
// chosen by its key) changed or removed, plus entries of its own (keys no other side
// uses). Applying both sides one after the other gives the expected merge.
function edited(doc: Doc, base: Doc, side: Owner, plans: Plan[], added: Mix[], addedPins: Pin[]): Doc {
  const copy = structuredClone(doc);
  const planOf = (key: string): Plan | undefined => {
    let hash = 0;
    for (const char of key) hash = (hash * 31 + char.charCodeAt(0)) % 1009;
    const p = plans[hash % plans.length];
    return p.owner === side && p.act !== 'keep' ? p : undefined;
  };
  const inBase = (id: string) => base.mixes.some((mix) => mix.id === id);
  copy.mixes = copy.mixes.flatMap((mix) => {
    const p = inBase(mix.id) ? planOf(mix.id) : undefined;
    if (!p) return [mix];
    return p.act === 'remove' ? [] : [{ ...mix, ...p.fields }];
  });
  copy.mixes.push(...added);
  for (const receiver of copy.receivers) {
    const original = base.receivers.find((r) => r.id === receiver.id);
    receiver.map = receiver.map.flatMap((pin) => {
      const p = original?.map.some((own) => own.pin === pin.pin) ? planOf(`${receiver.id}:${pin.pin}`) : undefined;
      if (!p) return [pin];
      return p.act === 'remove' ? [] : [{ ...pin, failsafe: p.failsafe }];
    });
  }
  copy.receivers[0].map.push(...addedPins);
  const p = planOf('model');
  if (p?.act === 'change') copy.model.weight_g = p.fields.weight + 5000;
  return copy;
}

const scenario = fc.record({
  base: baseDoc,
  plans: fc.array(plan, { minLength: 1, maxLength: 20 }),
  oursAdded: fc
    .uniqueArray(fc.constantFrom('o1', 'o2'), { maxLength: 2 })
    .chain((ids) => fc.tuple(...ids.map((id) => mixFields.map((fields) => ({ id, ...fields }))))),
  theirsAdded: fc
    .uniqueArray(fc.constantFrom('t1', 't2'), { maxLength: 2 })
    .chain((ids) => fc.tuple(...ids.map((id) => mixFields.map((fields) => ({ id, ...fields }))))),
  theirsPins: fc
    .uniqueArray(fc.integer({ min: 11, max: 14 }), { maxLength: 2 })
    .chain((pins) => fc.tuple(...pins.map((pin) => failsafe.map((value) => ({ pin, failsafe: value }))))),
});

const leaves = (data: unknown) => Object.fromEntries([...leafValues(data)].sort());

describe('mergeSetups', () => {
  it('equals both sides’ changes applied when no path changed on both sides', () => {
    fc.assert(
      fc.property(scenario, ({ base, plans, oursAdded, theirsAdded, theirsPins }) => {
        const ours = edited(base, base, 'ours', plans, oursAdded, []);
        const theirs = edited(base, base, 'theirs', plans, theirsAdded, theirsPins);
        const both = edited(ours, base, 'theirs', plans, theirsAdded, theirsPins);
        const merged = mergeSetups(base, ours, theirs);
        expect(merged.conflicts).toEqual([]);
        expect(leaves(merged.data)).toEqual(leaves(both));
      }),
      { numRuns: 300 },
    );
  });

  it('changes nothing when a side is merged into itself or the other side made no change', () => {
    fc.assert(
      fc.property(scenario, ({ base, plans, oursAdded }) => {
        const ours = edited(base, base, 'ours', plans, oursAdded, []);
        expect(mergeSetups(base, ours, ours)).toEqual({ data: ours, conflicts: [] });
        expect(mergeSetups(base, ours, base)).toEqual({ data: ours, conflicts: [] });
        expect(mergeSetups(ours, ours, ours)).toEqual({ data: ours, conflicts: [] });
        expect(leaves(mergeSetups(base, base, ours).data)).toEqual(leaves(ours));
      }),
      { numRuns: 300 },
    );
  });

  const base = {
    mixes: [
      { id: 'ail', weight: 100, expo: 20 },
      { id: 'ele', weight: 80, expo: 10 },
    ],
    receivers: [{ id: 'wing', map: [{ pin: 4, failsafe: 1500 }] }],
  };

  it('reports a path both sides changed differently, and takes the side a resolution names', () => {
    const ours = structuredClone(base);
    ours.receivers[0].map[0].failsafe = 1100;
    const theirs = structuredClone(base);
    theirs.receivers[0].map[0].failsafe = 1900;
    const path = 'receivers[id=wing].map[pin=4].failsafe';
    expect(mergeSetups(base, ours, theirs).conflicts).toEqual([{ path, base: 1500, ours: 1100, theirs: 1900 }]);
    const taken = mergeSetups(base, ours, theirs, { [path]: 'theirs' });
    expect(taken.conflicts).toEqual([]);
    expect(leafValues(taken.data).get(path)).toBe('1900');
  });

  it('reports an entry one side removed and the other changed at the entry’s path', () => {
    const ours = structuredClone(base);
    ours.mixes = ours.mixes.filter((mix) => mix.id !== 'ele');
    const theirs = structuredClone(base);
    theirs.mixes[1].expo = 35;
    expect(mergeSetups(base, ours, theirs).conflicts).toEqual([
      { path: 'mixes[id=ele]', base: base.mixes[1], ours: null, theirs: theirs.mixes[1] },
    ]);
    expect(mergeSetups(base, ours, theirs, { 'mixes[id=ele]': 'ours' }).data).toEqual(ours);
  });

  it('follows an entry renamed on one side while the other side changes it', () => {
    const ours = structuredClone(base);
    ours.mixes[0].id = 'aileron';
    const theirs = structuredClone(base);
    theirs.mixes[0].expo = 30;
    const merged = mergeSetups(base, ours, theirs);
    expect(merged.conflicts).toEqual([]);
    expect((merged.data as typeof base).mixes[0]).toEqual({ id: 'aileron', weight: 100, expo: 30 });
  });
});

describe('a top-level list named like a property every object has', () => {
  // Such a key has no identity key of its own, so its entries go by position. The
  // three threw on `constructor` before, and the merge read an Object method as a
  // resolution of the path `constructor`.
  const base = { constructor: [{ weight: 10 }], toString: [1] };
  const ours = { constructor: [{ weight: 20 }], toString: [1] };
  const theirs = { constructor: [{ weight: 10 }, { weight: 30 }], toString: [1, 2] };

  it('is one leaf, merged and written back like any list without an identity key', () => {
    expect(leaves(base)).toEqual({ constructor: '[{"weight":10}]', toString: '[1]' });
    expect(mergeSetups(base, ours, theirs).conflicts.map((conflict) => conflict.path)).toEqual(['constructor']);
    expect(mergeSetups(base, ours, theirs, { constructor: 'ours' as const }).data).toEqual({
      constructor: ours.constructor,
      toString: theirs.toString,
    });
    const text = 'constructor:\n  - weight: 10 # first\ntoString: [1]\n';
    const written = applyToText(text, base, theirs);
    expect(parse(written)).toEqual(theirs);
    expect(written).toContain('weight: 10 # first');
  });
});

// A line-diff of two texts: the lines only `before` has and the lines only `after` has.
function changedLines(before: string, after: string): { removed: string[]; added: string[] } {
  const removed: string[] = [];
  const added: string[] = [];
  for (const part of diffLines(before, after)) {
    const lines = part.value.replace(/\n$/, '').split('\n');
    if (part.removed) removed.push(...lines);
    if (part.added) added.push(...lines);
  }
  return { removed, added };
}

const demoText = readFileSync(
  fileURLToPath(new URL('../../fixtures/valid/scale-16-channel-two-receivers.yaml', import.meta.url)),
  'utf8',
);

describe('applyToText', () => {
  it('keeps comments and layout of what the edits do not touch', () => {
    const text = `# Heron, club trainer\nmodel:\n  name: Heron   # as painted\nmixes:\n  - id: ail # ailerons\n    expo: 20\n  - id: ele\n    expo: 10\n`;
    const before = parse(text) as { mixes: { id: string; expo: number }[] };
    const after = structuredClone(before);
    after.mixes[1].expo = 15;
    after.mixes.push({ id: 'rud', expo: 0 });
    const written = applyToText(text, before, after);
    expect(parse(written)).toEqual(after);
    expect(written).toBe(text.replace('    expo: 10\n', '    expo: 15\n  - id: rud\n    expo: 0\n'));
  });

  it('writes a fork taking in its source’s fixes into the demo text only on the lines of the changed settings', () => {
    // The fork renamed itself; the source meanwhile fixed settings across the document.
    const base = parse(demoText) as Demo;
    const oursText = demoText.replace('  name: Kestrel Mk II\n', '  name: Kestrel Mk II (club copy)\n');
    const ours = parse(oursText) as Demo;
    const theirs = structuredClone(base);
    theirs.receivers[0].map[2].failsafe = 990;
    theirs.channels[2].cut.value = -95;
    theirs.channels[8].travel = { reverse: true };
    theirs.mixes[2].expo = 18;
    theirs.mixes.splice(10, 0, { id: 'snap', from: 'rudder-stick', to: 4, weight: 10 });
    theirs.receivers[1].label = 'Wing receiver (green tape)';
    const merged = mergeSetups(base, ours, theirs);
    expect(merged.conflicts).toEqual([]);

    const written = applyToText(oursText, ours, merged.data);
    expect(parse(written)).toEqual(merged.data);
    expect(changedLines(oursText, written)).toEqual({
      removed: [
        '      cut: { control: motor-arm, position: 0, value: -100 } }',
        '  - { ch: 9,  function: tailwheel,     role: steering }',
        '  - { id: elevator,   from: elevator-stick, to: 2, weight: 92, expo: 15 }',
        '      - { pin: 3, ch: 3, failsafe: 1000 }   # motor must stop on signal loss',
        '    label: Wing receiver (red tape)',
      ],
      added: [
        '      cut: { control: motor-arm, position: 0, value: -95 } }',
        '  - { ch: 9,  function: tailwheel,     role: steering, travel: { reverse: true } }',
        '  - { id: elevator,   from: elevator-stick, to: 2, weight: 92, expo: 18 }',
        '  - { id: snap, from: rudder-stick, to: 4, weight: 10 }',
        '      - { pin: 3, ch: 3, failsafe: 990 }   # motor must stop on signal loss',
        '    label: Wing receiver (green tape)',
      ],
    });
    expect(written.split('\n')).toHaveLength(oursText.split('\n').length + 1);
    expect(written).toContain('  name: Kestrel Mk II (club copy)\n');
  });

  it('rewrites only the entry that changed places when a list is reordered', () => {
    const text = `mixes:\n  - { id: ail,  expo: 20 }   # ailerons\n  - { id: ele,  expo: 10 }   # elevator\n  - { id: rud,  expo: 0 }    # rudder\n`;
    const before = parse(text) as { mixes: unknown[] };
    const after = { mixes: [before.mixes[1], before.mixes[2], before.mixes[0]] };
    const written = applyToText(text, before, after);
    expect(parse(written)).toEqual(after);
    expect(changedLines(text, written)).toEqual({
      removed: ['  - { id: ail,  expo: 20 }   # ailerons'],
      added: ['  - { id: ail, expo: 20 }'],
    });
  });

  it('keeps every line of an entry the merge left alone, for random fork and source edits', () => {
    // The fork's text in the files' usual shape: a header comment, flow entries each
    // with a comment naming it, so any rewrite of an untouched entry would show.
    const mixLine = (mix: Mix) => `  - { id: ${mix.id}, weight: ${mix.weight}, expo: ${mix.expo} }   # mix ${mix.id}`;
    const pinLine = (pin: Pin) => `      - { pin: ${pin.pin}, failsafe: ${pin.failsafe} }   # pin ${pin.pin}`;
    const render = (doc: Doc) =>
      [
        '# the fork, as its pilot wrote it',
        'model:',
        `  name: ${doc.model.name}`,
        `  weight_g: ${doc.model.weight_g}`,
        doc.mixes.length > 0 ? 'mixes:' : 'mixes: []',
        ...doc.mixes.map(mixLine),
        'receivers:',
        ...doc.receivers.flatMap((receiver) => [
          `  - id: ${receiver.id}`,
          receiver.map.length > 0 ? '    map:' : '    map: []',
          ...receiver.map.map(pinLine),
        ]),
        '',
      ].join('\n');
    fc.assert(
      fc.property(scenario, ({ base, plans, oursAdded, theirsAdded, theirsPins }) => {
        const ours = edited(base, base, 'ours', plans, oursAdded, []);
        const theirs = edited(base, base, 'theirs', plans, theirsAdded, theirsPins);
        const merged = mergeSetups(base, ours, theirs).data as Doc;
        const text = render(ours);
        const written = applyToText(text, ours, merged);
        expect(parse(written)).toEqual(merged);
        const lines = new Set(written.split('\n'));
        expect(lines).toContain('# the fork, as its pilot wrote it');
        for (const mix of ours.mixes)
          if (merged.mixes.some((other) => JSON.stringify(other) === JSON.stringify(mix)))
            expect(lines).toContain(mixLine(mix));
        for (const receiver of ours.receivers) {
          const after = merged.receivers.find((other) => other.id === receiver.id);
          for (const pin of receiver.map)
            if (after?.map.some((other) => JSON.stringify(other) === JSON.stringify(pin)))
              expect(lines).toContain(pinLine(pin));
        }
      }),
      { numRuns: 200 },
    );
  });
});
