import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { diffSetups } from '@shared/diff';
import { loadPair, PAIRS } from './diff-pairs';

type Doc = Record<string, any>;

const clone = <T>(value: T): T => structuredClone(value);
const summaries = (before: unknown, after: unknown) =>
  diffSetups(before, after).changes.map((change) => change.summary);

describe('identity matching', () => {
  it('matches every list by identity key: the reordered fixture only has moves, one per reordered list', () => {
    const { before, after } = loadPair('reorder');
    const diff = diffSetups(before.data, after.data);
    expect(diff.counts).toEqual({ added: 0, removed: 0, changed: 0, renamed: 0, moved: 6 });
    expect(diff.changes.map((change) => change.path).sort()).toEqual(
      ['channels', 'controls', 'mixes', 'receivers', 'receivers[id=fuselage].map', 'receivers[id=wing].map'].sort(),
    );
    const mixes = diff.changes.find((change) => change.path === 'mixes');
    expect(mixes?.before).toEqual((before.data as Doc).mixes.map((mix: Doc) => mix.id));
    expect(mixes?.after).toEqual((after.data as Doc).mixes.map((mix: Doc) => mix.id));
  });

  it('reports no added, removed, changed or renamed entries for any reordering of every list (property)', () => {
    const base = loadPair('failsafe-fix').after.data as Doc;
    const permutation = (items: unknown[]) =>
      fc.shuffledSubarray(items, { minLength: items.length, maxLength: items.length });
    const shuffledDoc = fc
      .record({
        controls: permutation(base.controls),
        channels: permutation(base.channels),
        mixes: permutation(base.mixes),
        receivers: permutation(base.receivers.map((receiver: Doc, index: number) => index)),
        maps: fc.tuple(...base.receivers.map((receiver: Doc) => permutation(receiver.map))),
      })
      .map(({ controls, channels, mixes, receivers, maps }) => {
        const doc = clone(base);
        doc.controls = clone(controls);
        doc.channels = clone(channels);
        doc.mixes = clone(mixes);
        doc.receivers = (receivers as number[]).map((index) => ({
          ...clone(base.receivers[index]),
          map: clone(maps[index]),
        }));
        return doc;
      });
    fc.assert(
      fc.property(shuffledDoc, (doc) => {
        const diff = diffSetups(base, doc);
        expect(diff.counts.added + diff.counts.removed + diff.counts.changed + diff.counts.renamed).toBe(0);
        const ids = (list: Doc[], key: string) => list.map((item) => item[key]).join(',');
        const reordered = [
          ids(doc.controls, 'id') !== ids(base.controls, 'id'),
          ids(doc.channels, 'ch') !== ids(base.channels, 'ch'),
          ids(doc.mixes, 'id') !== ids(base.mixes, 'id'),
          ids(doc.receivers, 'id') !== ids(base.receivers, 'id'),
          ...base.receivers.map((receiver: Doc) => {
            const now = doc.receivers.find((candidate: Doc) => candidate.id === receiver.id);
            return ids(now.map, 'pin') !== ids(receiver.map, 'pin');
          }),
        ].filter(Boolean).length;
        expect(diff.counts.moved).toBe(reordered);
      }),
      { numRuns: 200 },
    );
  });

  it('matches a changed entry by its key wherever it sits in the list', () => {
    const before = loadPair('failsafe-fix').before.data as Doc;
    const after = clone(before);
    after.mixes.reverse();
    after.mixes.find((mix: Doc) => mix.id === 'elevator').weight = 80;
    const diff = diffSetups(before, after);
    expect(diff.changes.filter((change) => change.kind !== 'moved')).toEqual([
      {
        kind: 'changed',
        section: 'mixes',
        path: 'mixes[id=elevator].weight',
        before: 90,
        after: 80,
        summary: 'Mix elevator: weight 90 -> 80 %',
      },
    ]);
  });

  it('gives an identical pair no changes, and the same result for every fixture pair run twice', () => {
    for (const name of PAIRS) {
      const { before, after } = loadPair(name);
      expect(diffSetups(before.data, before.data).changes).toEqual([]);
      expect(diffSetups(before.data, after.data)).toEqual(diffSetups(clone(before.data), clone(after.data)));
    }
  });

  it('compares meaning: a default written out is no change', () => {
    const before = loadPair('trim-tuning').before.data as Doc;
    const after = clone(before);
    after.mixes[3].weight = 100;
    after.mixes[3].offset = 0;
    after.channels[1].travel = { low_us: 1000, center_us: 1500, high_us: 2000, reverse: false };
    after.receivers[0].telemetry = true;
    after.receivers[0].role = 'primary';
    expect(diffSetups(before, after).changes).toEqual([]);
  });
});

describe('accepted findings are matched by rule and path', () => {
  const base = () => {
    const doc = clone(loadPair('failsafe-fix').after.data as Doc);
    doc.accepted = [
      { rule: 'failsafe-unset', path: 'receivers[id=wing].map[pin=2]', reason: 'The lights may stay as they are' },
      { rule: 'control-unused', path: 'controls[id=flap-switch]', reason: 'Kept for the next season' },
    ];
    return doc;
  };

  it('reordering them is no change at all, not even a move', () => {
    const before = base();
    const after = clone(before);
    after.accepted.reverse();
    expect(diffSetups(before, after).changes).toEqual([]);
  });

  it('a changed reason is a change of that entry, named by its rule and path', () => {
    const before = base();
    const after = clone(before);
    after.accepted.reverse();
    after.accepted[1].reason = 'The lights are off for the maiden';
    const { changes } = diffSetups(before, after);
    expect(changes).toMatchObject([
      {
        kind: 'changed',
        section: 'accepted',
        path: 'accepted[rule=failsafe-unset,path=receivers[id=wing].map[pin=2]].reason',
        before: 'The lights may stay as they are',
        after: 'The lights are off for the maiden',
      },
    ]);
    expect(changes[0].summary).toBe(
      'Accepted failsafe-unset at receivers[id=wing].map[pin=2]: reason “The lights may stay as they are” -> “The lights are off for the maiden”',
    );
  });

  it('another path is another entry: one removed, one added, never a rename', () => {
    const before = base();
    const after = clone(before);
    after.accepted[0].path = 'receivers[id=wing].map[pin=3]';
    expect(diffSetups(before, after).changes.map((change) => [change.kind, change.path])).toEqual([
      ['added', 'accepted[rule=failsafe-unset,path=receivers[id=wing].map[pin=3]]'],
      ['removed', 'accepted[rule=failsafe-unset,path=receivers[id=wing].map[pin=2]]'],
    ]);
  });

  it('the first entry of a document that had none is that entry added', () => {
    const before = loadPair('failsafe-fix').after.data as Doc;
    const after = base();
    const { changes } = diffSetups(before, after);
    expect(changes.map((change) => [change.kind, change.path])).toEqual([
      ['added', 'accepted[rule=failsafe-unset,path=receivers[id=wing].map[pin=2]]'],
      ['added', 'accepted[rule=control-unused,path=controls[id=flap-switch]]'],
    ]);
    expect(changes[0].summary).toBe(
      'Accepted failsafe-unset at receivers[id=wing].map[pin=2] added (reason “The lights may stay as they are”)',
    );
  });
});

describe('renames', () => {
  const { before, after } = loadPair('renames');
  const diff = diffSetups(before.data, after.data);

  it('detects a control, a mix and a channel function renamed, and reports references that follow as changes', () => {
    expect(diff.counts).toEqual({ added: 0, removed: 0, changed: 3, renamed: 3, moved: 0 });
    const renamed = diff.changes.filter((change) => change.kind === 'renamed');
    expect(renamed.map(({ path, before: was, after: now }) => ({ path, was, now }))).toEqual([
      { path: 'controls[id=gear-switch]', was: 'gear-switch', now: 'retract-switch' },
      { path: 'channels[ch=5]', was: 5, now: 9 },
      { path: 'mixes[id=flap-trim]', was: 'flap-trim', now: 'camber-trim' },
    ]);
    expect(renamed.map((change) => change.summary)).toEqual([
      'Control gear-switch renamed to retract-switch',
      'Function gear moved from channel 5 to channel 9',
      'Mix flap-trim renamed to camber-trim',
    ]);
    expect(diff.changes.filter((change) => change.kind === 'changed').map((change) => change.path)).toEqual([
      'mixes[id=gear].from',
      'mixes[id=gear].to',
      'receivers[id=main].map[pin=5].ch',
    ]);
  });

  it('renames a receiver and a pin map entry whose content is unchanged', () => {
    const doc = before.data as Doc;
    const next = clone(doc);
    next.receivers[0].id = 'nose';
    expect(summaries(doc, next)).toEqual(['Receiver main renamed to nose']);
    const moved = clone(doc);
    moved.receivers[0].map[7].pin = 9;
    moved.receivers[0].outputs = 8;
    expect(diffSetups(doc, moved).changes).toMatchObject([
      {
        kind: 'renamed',
        path: 'receivers[id=main].map[pin=8]',
        before: 8,
        after: 9,
        summary: 'Main receiver: channel 8 (lights) moved from pin 8 to pin 9',
      },
    ]);
  });

  it('does not call an entry renamed when its content changed too', () => {
    const doc = before.data as Doc;
    const next = clone(doc);
    next.mixes[2].id = 'pitch';
    next.mixes[2].expo = 35;
    expect(diffSetups(doc, next).changes.map((change) => [change.kind, change.path])).toEqual([
      ['added', 'mixes[id=pitch]'],
      ['removed', 'mixes[id=elevator]'],
    ]);
  });
});

describe('sentences and paths', () => {
  it('says what changed on a pin with the receiver label and the unit', () => {
    const { before, after } = loadPair('failsafe-fix');
    expect(diffSetups(before.data, after.data).changes).toEqual([
      {
        kind: 'changed',
        section: 'receivers',
        path: 'receivers[id=wing].map[pin=3].failsafe',
        before: 988,
        after: 1500,
        summary: 'Wing receiver pin 3: failsafe 988 -> 1500 µs',
      },
    ]);
    expect(summaries(after.data, before.data)).toEqual(['Wing receiver pin 3: failsafe 1500 -> 988 µs']);
  });

  it('names channels by what they carry when pins are remapped', () => {
    const { before, after } = loadPair('remap-second-receiver');
    const diff = diffSetups(before.data, after.data);
    expect(diff.counts.changed).toBe(8);
    expect(diff.changes[0]).toMatchObject({
      path: 'receivers[id=wing].map[pin=1].ch',
      before: 1,
      after: 9,
      summary: 'Wing receiver pin 1: channel 1 (aileron-left) -> 9 (tow-release)',
    });
  });

  it('describes changed mix values in percent and counts them per section', () => {
    const { before, after } = loadPair('trim-tuning');
    const diff = diffSetups(before.data, after.data);
    expect(diff.changes.map((change) => change.summary)).toEqual([
      'Mix ail-left: rates weights 100/65 -> 100/70 %',
      'Mix ail-right: rates weights 100/65 -> 100/70 %',
      'Mix elevator: expo 20 -> 30 %',
      'Mix flap-trim: weight -8 -> -12 %',
    ]);
    expect(diff.sections.mixes).toEqual({ added: 0, removed: 0, changed: 4, renamed: 0, moved: 0 });
    for (const section of ['format', 'model', 'link', 'controls', 'channels', 'receivers', 'power', 'other'] as const) {
      expect(diff.sections[section].changed).toBe(0);
    }
  });

  it('describes added and removed entries', () => {
    const { before, after } = loadPair('receiver-added');
    const added = diffSetups(before.data, after.data);
    expect(added.changes.map((change) => [change.kind, change.section, change.summary])).toEqual([
      ['changed', 'link', 'Link channels 8 -> 16'],
      ['added', 'controls', 'Control release-switch added (switch, 2 positions)'],
      ['added', 'channels', 'Channel 9 added: carries tow-release (role payload)'],
      ['added', 'mixes', 'Mix release added (release-switch -> channel 9 (tow-release), weight 100 %)'],
      ['added', 'receivers', 'Receiver tail added (8 outputs, telemetry off)'],
    ]);
    const tail = added.changes.find((change) => change.path === 'receivers[id=tail]');
    expect(tail).toMatchObject({
      before: null,
      after: { id: 'tail', outputs: 8, telemetry: false, role: 'secondary' },
    });
    const removed = diffSetups(after.data, before.data);
    expect(removed.counts).toEqual({ added: 0, removed: 4, changed: 1, renamed: 0, moved: 0 });
    expect(removed.changes.map((change) => change.summary)).toContain('Receiver tail removed');
    expect(removed.changes.map((change) => change.summary)).toContain('Channel 9 (tow-release) removed');
  });

  it('says when a channel now carries a second function', () => {
    const doc = loadPair('trim-tuning').before.data as Doc;
    const next = clone(doc);
    next.channels.push({ ch: 8, function: 'gear-doors', role: 'gear' });
    expect(diffSetups(doc, next).changes).toMatchObject([
      { kind: 'added', path: 'channels[ch=8#2]', summary: 'Channel 8 now also carries gear-doors' },
    ]);
  });

  it('describes fields added, removed and changed inside entries and sections', () => {
    const doc = loadPair('trim-tuning').before.data as Doc;
    const next = clone(doc);
    delete next.channels[2].cut;
    next.channels[5].travel = { low_us: 1100, center_us: 1500, high_us: 2000, reverse: true };
    next.receivers[0].map[4].failsafe = 1500;
    delete next.receivers[0].map[5].failsafe;
    next.model.weight_g = 1720;
    next.power.receiver_supply = 'both';
    next.radio_notes = 'bench tested';
    expect(summaries(doc, next)).toEqual([
      'Model weight 1650 -> 1720 g',
      'Channel 3 (motor): cut removed (was: motor-arm at position 0 forces -100 %)',
      'Channel 6 (aileron-right): travel low end 1000 -> 1100 µs',
      'Channel 6 (aileron-right): reverse off -> on',
      'Main receiver pin 5: failsafe hold -> 1500 µs',
      'Main receiver pin 6: failsafe 1500 µs -> unset (receiver default)',
      'Power receiver supply esc-bec -> both',
      'Extra field radio_notes: unset -> “bench tested”',
    ]);
  });
});

describe('typed text in sentences', () => {
  const doc = loadPair('trim-tuning').before.data as Doc;
  const NOTES =
    'Scale low wing, flaps on the three-position switch, maiden planned for the May fly-in at the club field.';

  it('quotes names, labels and notes, and leaves numbers, choices and ids bare', () => {
    const next = clone(doc);
    next.model.name = 'Kestrel Mk II';
    next.receivers[0].label = 'Fuselage unit';
    next.controls[0].label = 'Left stick,\n  side to side';
    next.model.weight_g = 1720;
    next.power.receiver_supply = 'both';
    expect(summaries(doc, next)).toEqual([
      'Model name: “Pipit 1400” -> “Kestrel Mk II”',
      'Model weight 1650 -> 1720 g',
      'Control aileron-stick: label unset -> “Left stick, side to side”',
      'Receiver main: label “Main receiver” -> “Fuselage unit”',
      'Power receiver supply esc-bec -> both',
    ]);
    const added = clone(doc);
    added.controls.push({ id: 'smoke-switch', kind: 'switch', positions: 2, label: 'Smoke pump' });
    expect(summaries(doc, added)).toEqual(['Control smoke-switch added (switch, 2 positions, labelled “Smoke pump”)']);
  });

  it('cuts long text with an ellipsis, and shows both sides from near their first difference', () => {
    const noted = clone(doc);
    noted.model.notes = NOTES;
    expect(summaries(doc, noted)).toEqual([
      'Model notes: unset -> “Scale low wing, flaps on the three-position switch, maiden…”',
    ]);
    const later = clone(noted);
    later.model.notes = NOTES.replace('May', 'June');
    expect(summaries(noted, later)).toEqual([
      'Model notes: “…maiden planned for the May fly-in at the club field.” -> “…maiden planned for the June fly-in at the club field.”',
    ]);
    const short = clone(noted);
    short.model.notes = 'Scale low wing.';
    expect(summaries(noted, short)).toEqual([
      'Model notes: “Scale low wing, flaps on the three-position switch, maiden…” -> “Scale low wing.”',
    ]);
  });
});

describe('robustness', () => {
  it('never throws, whatever the two documents are (property)', () => {
    fc.assert(
      fc.property(fc.oneof(fc.jsonValue(), fc.anything()), fc.oneof(fc.jsonValue(), fc.anything()), (a, b) => {
        const diff = diffSetups(a, b);
        expect(diff.changes.length).toBe(Object.values(diff.counts).reduce((sum, n) => sum + n, 0));
      }),
      { numRuns: 300 },
    );
  });

  it('sees changes under keys that objects inherit, such as __proto__ and constructor', () => {
    const doc = loadPair('trim-tuning').before.data as Doc;
    const next = clone(doc);
    next.mixes[0] = JSON.parse(JSON.stringify({ ...doc.mixes[0], constructor: 'x' }));
    next.power = JSON.parse('{"receiver_supply": "esc-bec", "__proto__": {"volts": 6}}');
    const diff = diffSetups(doc, next);
    expect(diff.changes.map((change) => [change.kind, change.path, change.summary])).toEqual([
      ['changed', 'mixes[id=ail-left].constructor', 'Mix ail-left: constructor unset -> “x”'],
      ['added', 'power.__proto__', 'Power __proto__ added (volts 6)'],
    ]);
  });

  it('diffs schema-invalid documents, with duplicate keys and entries without keys', () => {
    const doc = loadPair('trim-tuning').before.data as Doc;
    const broken = clone(doc);
    broken.mixes[0].weight = 'lots';
    broken.controls.push({ kind: 'axis' });
    broken.channels.push({ ch: 2, function: 'elevator-2', role: 'elevator' });
    broken.receivers[0].map = 'none';
    const diff = diffSetups(doc, broken);
    expect(diff.changes.map((change) => [change.kind, change.path])).toEqual([
      ['added', 'controls[9]'],
      ['added', 'channels[ch=2#2]'],
      ['changed', 'mixes[id=ail-left].weight'],
      ['changed', 'receivers[id=main].map'],
    ]);
    // From nothing: the format value is set, the model, link and power sections and
    // every list entry are added.
    const fromNothing = diffSetups(null, doc);
    expect(fromNothing.counts).toEqual({
      added: 3 + doc.controls.length + doc.channels.length + doc.mixes.length + doc.receivers.length,
      removed: 0,
      changed: 1,
      renamed: 0,
      moved: 0,
    });
    expect(fromNothing.changes[0]).toMatchObject({ path: 'format', before: null, after: 'bindery-setup/1' });
  });
});
