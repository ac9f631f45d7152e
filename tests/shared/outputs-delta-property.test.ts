import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { outputsDelta } from '@shared/diff';
import { evaluate } from '@shared/evaluate/evaluate';
import { restPositions } from '@shared/evaluate/rest';
import { setupSchema, type Setup } from '@shared/format/schema';

// outputs_delta is empty exactly when no pin's pulse differs at any position or link
// state. Checked against brute force on small random pairs: every grid point where
// the bench gives different pulses must mean a non-empty delta, and every entry the
// delta reports must show different pulses at its own position when evaluated.

const failsafe = fc.constantFrom<number | 'hold' | 'off' | undefined>(1000, 1500, 1510, 2000, 'hold', 'off', undefined);

const mix = fc.record({
  from: fc.constantFrom('stick', 'flip'),
  to: fc.constantFrom(1, 2),
  weight: fc.integer({ min: -120, max: 120 }),
  offset: fc.integer({ min: -30, max: 30 }),
  expo: fc.integer({ min: 0, max: 100 }),
  rates: fc.option(
    fc.tuple(
      fc.integer({ min: -100, max: 100 }),
      fc.integer({ min: -100, max: 100 }),
      fc.integer({ min: -100, max: 100 }),
    ),
    { nil: undefined },
  ),
  active: fc.option(fc.subarray([0, 1, 2], { minLength: 1 }), { nil: undefined }),
});

const doc = fc.record({
  reverse: fc.boolean(),
  throttle: fc.boolean(),
  mixes: fc.array(mix, { minLength: 1, maxLength: 3 }),
  failsafes: fc.tuple(failsafe, failsafe, failsafe),
});

type Doc = typeof doc extends fc.Arbitrary<infer T> ? T : never;

function build(d: Doc): Setup {
  return setupSchema.parse({
    format: 'bindery-setup/1',
    model: { name: 'Random pair', airframe: 'airplane' },
    link: { channels: 8 },
    controls: [
      { id: 'stick', kind: 'axis' },
      { id: 'flip', kind: 'switch', positions: 3 },
    ],
    channels: [
      { ch: 1, function: 'one', role: d.throttle ? 'throttle' : 'aux', travel: { reverse: d.reverse } },
      { ch: 2, function: 'two', role: 'aux' },
    ],
    mixes: d.mixes.map((m, i) => ({
      id: `m${i}`,
      from: m.from,
      to: m.to,
      weight: m.weight,
      offset: m.offset,
      expo: m.expo,
      ...(m.rates ? { rates: { control: 'flip', weights: m.rates } } : {}),
      ...(m.active ? { active: { control: 'flip', positions: m.active } } : {}),
    })),
    receivers: [
      {
        id: 'rx-a',
        outputs: 4,
        map: [
          { pin: 1, ch: 1, failsafe: d.failsafes[0] },
          { pin: 2, ch: 2, failsafe: d.failsafes[1] },
        ],
      },
      {
        id: 'rx-b',
        role: 'secondary',
        telemetry: false,
        outputs: 4,
        map: [{ pin: 1, ch: 1, failsafe: d.failsafes[2] }],
      },
    ],
  });
}

/** A pair: a document and the same with a few small edits (or none). */
const pair = doc.chain((d) =>
  fc
    .record({
      expo: fc.option(fc.integer({ min: 0, max: 100 }), { nil: undefined }),
      weight: fc.option(fc.integer({ min: -120, max: 120 }), { nil: undefined }),
      reverse: fc.boolean(),
      failsafe: fc.option(failsafe, { nil: null }),
    })
    .map((edit): [Doc, Doc] => {
      const after: Doc = structuredClone(d);
      if (edit.expo !== undefined) after.mixes[0].expo = edit.expo;
      if (edit.weight !== undefined) after.mixes[after.mixes.length - 1].weight = edit.weight;
      if (edit.reverse) after.reverse = !after.reverse;
      if (edit.failsafe !== null) after.failsafes[2] = edit.failsafe;
      return [d, after];
    }),
);

const LINKS: Set<string>[] = [new Set(), new Set(['rx-a']), new Set(['rx-b'])];

function pulses(setup: Setup, positions: Record<string, number>, lost: Set<string>): (number | null)[] {
  return evaluate(setup, { ...restPositions(setup), ...positions }, lost).receivers.flatMap((r) =>
    r.pins.map((p) => p.pulse_us),
  );
}

function gridDiffers(before: Setup, after: Setup): boolean {
  for (const lost of LINKS)
    for (let flip = 0; flip < 3; flip += 1)
      for (let stick = -100; stick <= 100; stick += 5) {
        const a = pulses(before, { stick, flip }, lost);
        const b = pulses(after, { stick, flip }, lost);
        if (a.some((value, i) => value !== b[i])) return true;
      }
  return false;
}

/** Each pin (receiver and pin number) whose pulse differs somewhere on the grid. */
function pinsThatDiffer(before: Setup, after: Setup): Set<string> {
  const found = new Set<string>();
  const keys = evaluate(after, restPositions(after), new Set()).receivers.flatMap((r) =>
    r.pins.map((p) => `${r.id}:${p.pin}`),
  );
  for (const lost of LINKS)
    for (let flip = 0; flip < 3; flip += 1)
      for (let stick = -100; stick <= 100; stick += 5) {
        const a = pulses(before, { stick, flip }, lost);
        const b = pulses(after, { stick, flip }, lost);
        a.forEach((value, i) => {
          if (value !== b[i]) found.add(keys[i]);
        });
      }
  return found;
}

describe('outputs delta against brute force', () => {
  // Pins made identically on both sides are passed over without a search (sameSource):
  // a pin the bench shows differing must still be reported, whichever pins changed.
  it('names every pin whose pulse differs somewhere on the grid', () => {
    fc.assert(
      fc.property(pair, ([left, right]) => {
        const before = build(left);
        const after = build(right);
        const reported = new Set(outputsDelta(before, after).map((row) => `${row.receiver}:${row.pin}`));
        const differing = pinsThatDiffer(before, after);
        for (const pin of differing) expect(reported).toContain(pin);
      }),
      { numRuns: 80, seed: 20261203 },
    );
  }, 120_000);

  it('is empty exactly when the bench finds no pulse that differs', () => {
    fc.assert(
      fc.property(pair, ([left, right]) => {
        const before = build(left);
        const after = build(right);
        const delta = outputsDelta(before, after);
        if (gridDiffers(before, after)) expect(delta.length).toBeGreaterThan(0);
        for (const row of delta) {
          const lost = new Set(row.position.lost);
          const at = (setup: Setup) =>
            evaluate(setup, { ...restPositions(setup), ...row.position.set }, lost)
              .receivers.find((r) => r.id === row.receiver)!
              .pins.find((p) => p.pin === row.pin)!.pulse_us;
          expect([at(before), at(after)]).toEqual([row.before_us, row.after_us]);
          expect(row.before_us).not.toBe(row.after_us);
        }
      }),
      { numRuns: 80, seed: 20261202 },
    );
  }, 120_000);
});
