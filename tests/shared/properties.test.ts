import fc from 'fast-check';
import { Document, isScalar, stringify, visit } from 'yaml';
import { describe, expect, it } from 'vitest';
import { analyzeSetup, analyzeSetupFast, analyzeSetupFully } from '@shared/analyze';
import { contentHash } from '@shared/canonical/content-hash';
import { evaluate } from '@shared/evaluate/evaluate';
import { AIRFRAMES, CHANNEL_ROLES, DEFAULT_TRAVEL } from '@shared/format/schema';
import { readSetupFast } from '@shared/parse/fast-read';
import { validFixtures } from './setup-fixtures';
import { parseYaml } from '@shared/parse/parse-yaml';

// Random setups that pass the schema but mean anything at all: ids collide, mixes name
// missing controls, pins exceed outputs, failsafes are wild. The checks and the bench
// evaluation must cope with every one of them.

const slug = fc.constantFrom('stick', 'knob', 'slide', 'two', 'three', 'spare', 'x-1');
const percent = (limit: number) => fc.double({ min: -limit, max: limit, noNaN: true });

const control = fc.oneof(
  fc.record({ id: slug, kind: fc.constantFrom('axis', 'knob', 'slider') }),
  fc.record(
    { id: slug, kind: fc.constant('switch'), positions: fc.constantFrom(2, 3) },
    { requiredKeys: ['id', 'kind'] },
  ),
);

const orderedTravel = fc
  .uniqueArray(fc.integer({ min: 600, max: 2400 }), { minLength: 3, maxLength: 3 })
  .chain((pulses) => {
    const [low_us, center_us, high_us] = [...pulses].sort((a, b) => a - b);
    return fc.record({
      low_us: fc.constant(low_us),
      center_us: fc.constant(center_us),
      high_us: fc.constant(high_us),
      reverse: fc.boolean(),
    });
  });

const channel = fc.record(
  {
    ch: fc.integer({ min: 1, max: 32 }),
    function: fc.constantFrom('aileron', 'motor', 'flap-left', 'flap-right', 'gear', 'aux-1'),
    role: fc.constantFrom(...CHANNEL_ROLES),
    side: fc.constantFrom('left', 'right'),
    travel: orderedTravel,
    cut: fc.record({ control: slug, position: fc.integer({ min: 0, max: 3 }), value: percent(100) }),
  },
  { requiredKeys: ['ch', 'function', 'role'] },
);

const mix = fc.record(
  {
    id: fc.constantFrom('m1', 'm2', 'm3', 'm4', 'm5', 'm6'),
    from: slug,
    to: fc.integer({ min: 1, max: 32 }),
    weight: percent(200),
    offset: percent(100),
    expo: fc.double({ min: 0, max: 100, noNaN: true }),
    rates: fc.record({ control: slug, weights: fc.array(percent(200), { minLength: 2, maxLength: 3 }) }),
    active: fc.record({
      control: slug,
      positions: fc.array(fc.integer({ min: 0, max: 3 }), { minLength: 1, maxLength: 3 }),
    }),
  },
  { requiredKeys: ['id', 'from', 'to'] },
);

const receiver = fc.record(
  {
    id: fc.constantFrom('rx-a', 'rx-b', 'rx-c'),
    role: fc.constantFrom('primary', 'secondary'),
    outputs: fc.integer({ min: 1, max: 32 }),
    telemetry: fc.boolean(),
    map: fc.array(
      fc.record(
        {
          pin: fc.integer({ min: 1, max: 32 }),
          ch: fc.integer({ min: 1, max: 32 }),
          failsafe: fc.oneof(fc.integer({ min: 0, max: 3000 }), fc.constantFrom('hold', 'off')),
        },
        { requiredKeys: ['pin', 'ch'] },
      ),
      { maxLength: 10 },
    ),
  },
  { requiredKeys: ['id', 'outputs'] },
);

const setupData = fc.record(
  {
    format: fc.constant('bindery-setup/1'),
    model: fc.record(
      {
        name: fc.constantFrom('Random', 'Heavy one'),
        airframe: fc.constantFrom(...AIRFRAMES),
        weight_g: fc.integer({ min: 1, max: 20_000 }),
      },
      { requiredKeys: ['name', 'airframe'] },
    ),
    link: fc.record({ channels: fc.integer({ min: 4, max: 32 }) }),
    controls: fc.array(control, { minLength: 1, maxLength: 6 }),
    channels: fc.array(channel, { maxLength: 10 }),
    mixes: fc.array(mix, { maxLength: 12 }),
    receivers: fc.array(receiver, { minLength: 1, maxLength: 3 }),
    power: fc.record({ receiver_supply: fc.constantFrom('esc-bec', 'separate-pack', 'both') }),
  },
  { requiredKeys: ['format', 'model', 'link', 'controls', 'channels', 'receivers'] },
);

const positions = fc.dictionary(slug, fc.oneof(fc.integer({ min: -1, max: 4 }), percent(150)), { maxKeys: 7 });

describe('checks on random valid documents', () => {
  it('never crash and give well-formed findings', () => {
    fc.assert(
      fc.property(setupData, (data) => {
        const analysis = analyzeSetup(stringify(data));
        expect(analysis.setup).not.toBeNull();
        for (const finding of analysis.findings) {
          expect(finding.line).toBeGreaterThanOrEqual(1);
          expect(finding.column).toBeGreaterThanOrEqual(1);
          expect(finding.message.length).toBeGreaterThan(10);
          expect(finding.path.length).toBeGreaterThan(0);
        }
      }),
      { numRuns: 200 },
    );
  }, 60_000);
});

describe('evaluation on random valid documents', () => {
  it("gives pulses within each channel's travel, whatever the control positions", () => {
    fc.assert(
      fc.property(setupData, positions, (data, at) => {
        const { setup } = analyzeSetup(stringify(data));
        expect(setup).not.toBeNull();
        const outputs = evaluate(setup!, at);
        const travelOf = (ch: number) => setup!.channels.find((c) => c.ch === ch)?.travel ?? DEFAULT_TRAVEL;
        outputs.channels.forEach((out, i) => {
          const travel = [...setup!.channels].sort((a, b) => a.ch - b.ch)[i].travel;
          expect(out.value).toBeGreaterThanOrEqual(-100);
          expect(out.value).toBeLessThanOrEqual(100);
          expect(out.pulse_us).toBeGreaterThanOrEqual(travel.low_us);
          expect(out.pulse_us).toBeLessThanOrEqual(travel.high_us);
        });
        for (const receiver of outputs.receivers) {
          for (const pin of receiver.pins) {
            const travel = travelOf(pin.ch);
            expect(pin.pulse_us).toBeGreaterThanOrEqual(travel.low_us);
            expect(pin.pulse_us).toBeLessThanOrEqual(travel.high_us);
          }
        }
      }),
      { numRuns: 200 },
    );
  }, 60_000);
});

// The ways the same data is written: the yaml package's default block style, all flow,
// double-quoted strings, and block style with a comment before the document and after
// every scalar value.
function commented(data: unknown): string {
  const doc = new Document(data);
  doc.commentBefore = ' written by the property test';
  visit(doc, {
    Pair(_, pair) {
      if (isScalar(pair.value)) pair.value.comment = ' note';
    },
  });
  return doc.toString();
}

const writers: Record<string, (data: unknown) => string> = {
  block: (data) => stringify(data),
  flow: (data) => stringify(data, { collectionStyle: 'flow' }),
  quoted: (data) => stringify(data, { defaultStringType: 'QUOTE_DOUBLE' }),
  commented,
};

describe('the fast reader on random valid documents', () => {
  it.each(Object.keys(writers))(
    'reads %s text to the same data as the reference reader, or declines',
    (style) => {
      let read = 0;
      fc.assert(
        fc.property(setupData, (data) => {
          const text = writers[style](data);
          const fast = readSetupFast(text);
          if (fast === null) return;
          read += 1;
          const full = parseYaml(text);
          expect(full.readable).toBe(true);
          expect(fast).toStrictEqual(full.data);
          expect(contentHash(fast)).toBe(contentHash(full.data));
        }),
        { numRuns: 200, seed: 20260101 },
      );
      // The property says nothing if the fast reader declines everything.
      expect(read).toBeGreaterThan(150);
    },
    60_000,
  );

  it('gives the same analysis as the reference for setups with no findings, whatever the names', () => {
    // Random setups nearly always have findings, so these start from the finding-free
    // fixtures and vary the free text, which is where scalar forms differ most.
    const clean = validFixtures().map(
      (fixture) => parseYaml(fixture.text).data as Record<string, Record<string, unknown>>,
    );
    let answered = 0;
    fc.assert(
      fc.property(
        fc.constantFrom(...clean),
        fc.string({ minLength: 1, maxLength: 40 }),
        fc.constantFrom(...Object.keys(writers)),
        (base, name, style) => {
          const text = writers[style]({ ...base, model: { ...base.model, name } });
          const fast = analyzeSetupFast(text);
          if (fast === null) return;
          answered += 1;
          expect(fast).toStrictEqual(analyzeSetupFully(text));
        },
      ),
      { numRuns: 300, seed: 20260102 },
    );
    expect(answered).toBeGreaterThan(200);
  }, 60_000);
});
