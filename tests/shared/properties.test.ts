import fc from 'fast-check';
import { stringify } from 'yaml';
import { describe, expect, it } from 'vitest';
import { analyzeSetup } from '../../shared/analyze';
import { evaluate } from '../../shared/evaluate/evaluate';
import { AIRFRAMES, CHANNEL_ROLES, DEFAULT_TRAVEL } from '../../shared/format/schema';

// Random setups that pass the schema but mean anything at all: ids collide, mixes name
// missing controls, pins exceed outputs, failsafes are wild. The checks and the bench
// evaluation must cope with every one of them.

const slug = fc.constantFrom('stick', 'knob', 'slide', 'two', 'three', 'spare', 'x-1');
const percent = (limit: number) => fc.double({ min: -limit, max: limit, noNaN: true });

const control = fc.oneof(
  fc.record({ id: slug, kind: fc.constantFrom('axis', 'knob', 'slider') }),
  fc.record({ id: slug, kind: fc.constant('switch'), positions: fc.constantFrom(2, 3) }, { requiredKeys: ['id', 'kind'] }),
);

const orderedTravel = fc
  .uniqueArray(fc.integer({ min: 600, max: 2400 }), { minLength: 3, maxLength: 3 })
  .chain((pulses) => {
    const [low_us, center_us, high_us] = [...pulses].sort((a, b) => a - b);
    return fc.record({ low_us: fc.constant(low_us), center_us: fc.constant(center_us), high_us: fc.constant(high_us), reverse: fc.boolean() });
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
    active: fc.record({ control: slug, positions: fc.array(fc.integer({ min: 0, max: 3 }), { minLength: 1, maxLength: 3 }) }),
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
      { name: fc.constantFrom('Random', 'Heavy one'), airframe: fc.constantFrom(...AIRFRAMES), weight_g: fc.integer({ min: 1, max: 20_000 }) },
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
  it('gives pulses within each channel\'s travel, whatever the control positions', () => {
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
