import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyzeSetup } from '@shared/analyze';
import { channelExtremes } from '@shared/evaluate/channel-extremes';
import { controlsById } from '@shared/evaluate/control-value';
import { controlValue, evaluate, idlePulse, pulseFor, roundPulse } from '@shared/evaluate/evaluate';
import { expoCurve } from '@shared/evaluate/expo-curve';
import { mixCurve } from '@shared/evaluate/mix-curve';
import { DEFAULT_TRAVEL, setupSchema, type Setup } from '@shared/format/schema';
import { readFixture } from './setup-fixtures';

function setupOf(text: string): Setup {
  const { setup, findings } = analyzeSetup(text);
  if (!setup) throw new Error(`not a valid setup: ${findings.map((f) => f.message).join(' ')}`);
  return setup;
}

const trainer = setupOf(readFixture('valid/trainer-single-receiver.yaml'));
const demo = setupOf(readFixture('valid/scale-16-channel-two-receivers.yaml'));
const channel = (setup: Setup, positions: Record<string, number>, ch: number) =>
  evaluate(setup, positions).channels.find((c) => c.ch === ch)!;

describe('expo curve', () => {
  it('k = 0.3, x = 0.5 gives 0.3875', () => {
    // [expo-cubic] 0.7 * 0.5 + 0.3 * 0.125 = 0.3875
    expect(expoCurve(0.5, 30)).toBeCloseTo(0.3875, 12);
  });

  it('k = 1, x = 0.5 gives 0.125', () => {
    // [expo-cubic] pure cubic: 0.5^3
    expect(expoCurve(0.5, 100)).toBeCloseTo(0.125, 12);
  });

  it('any k at x = 1 gives 1, and k = 0 is linear', () => {
    // [expo-cubic]
    for (const expo of [0, 25, 60, 100]) {
      expect(expoCurve(1, expo)).toBeCloseTo(1, 12);
      expect(expoCurve(-1, expo)).toBeCloseTo(-1, 12);
    }
    expect(expoCurve(0.37, 0)).toBeCloseTo(0.37, 12);
  });
});

describe('control values', () => {
  const three = { id: 'flap-switch', kind: 'switch', positions: 3 } as const;
  const two = { id: 'gear-switch', kind: 'switch', positions: 2 } as const;

  it('a 3-position switch gives -100, 0, +100', () => {
    // docs/format.md, Evaluation 1: -100 + 200 p / (n - 1)
    expect([0, 1, 2].map((p) => controlValue(three, p))).toEqual([-100, 0, 100]);
  });

  it('a 2-position switch gives -100, +100', () => {
    expect([0, 1].map((p) => controlValue(two, p))).toEqual([-100, 100]);
  });

  it('axes take their percent, kept within -100..100; unset is 0', () => {
    const axis = { id: 'aileron-stick', kind: 'axis' } as const;
    expect(controlValue(axis, 42)).toBe(42);
    expect(controlValue(axis, 250)).toBe(100);
    expect(controlValue(axis, undefined)).toBe(0);
  });
});

describe('pulses', () => {
  it('the default travel is 1000 / 1500 / 2000 microseconds', () => {
    // [arduino-servo] writeMicroseconds: 1000 one end, 1500 the middle, 2000 the other end
    expect([-100, 0, 100].map((v) => pulseFor(DEFAULT_TRAVEL, v))).toEqual([1000, 1500, 2000]);
    const { travel } = setupSchema.parse(setupWith({})).channels[0];
    expect(travel).toEqual({ low_us: 1000, center_us: 1500, high_us: 2000, reverse: false });
  });

  it('reversed travel mirrors the pulse about centre', () => {
    const reversed = { ...DEFAULT_TRAVEL, reverse: true };
    expect(pulseFor(reversed, 50)).toBe(1250);
    expect(pulseFor(reversed, -100)).toBe(2000);
    expect(idlePulse(reversed)).toBe(2000);
    // The demo's right aileron is reversed: with the stick at +50 % it moves opposite the left one.
    expect(
      channel(demo, { 'aileron-stick': 50 }, 1).pulse_us + channel(demo, { 'aileron-stick': 50 }, 6).pulse_us,
    ).toBe(3000);
  });

  it('rounding a pulse skips the 12-digit clean-up only where it cannot matter', () => {
    // roundPulse rounds without the clean-up away from a half; it must agree with the
    // rule as written (12 significant digits, then Math.round) everywhere, sign of
    // zero included.
    const byTheRule = (pulse: number) => Math.round(Number(pulse.toPrecision(12)));
    const nearHalves = fc
      .tuple(fc.integer({ min: -3000, max: 3000 }), fc.integer({ min: -2000, max: 2000 }))
      .map(([whole, ulps]) => whole + 0.5 + ulps * 2 ** -40);
    const pulses = fc.oneof(fc.double(), fc.double({ min: -3000, max: 3000 }), nearHalves);
    fc.assert(
      fc.property(pulses, (pulse) => Object.is(roundPulse(pulse), byTheRule(pulse))),
      { numRuns: 20000 },
    );
    for (const pulse of [0, -0, 27.125, 1512.4999999999998, 1512.5000000000002, -0.5, -0.49, 2 ** 53, -Infinity, NaN])
      expect(Object.is(roundPulse(pulse), byTheRule(pulse))).toBe(true);
  });

  it('an uneven travel scales each side on its own and rounds to the microsecond', () => {
    const travel = { low_us: 1100, center_us: 1520, high_us: 1900, reverse: false };
    expect(pulseFor(travel, 50)).toBe(1710);
    expect(pulseFor(travel, -50)).toBe(1310);
    expect(pulseFor(travel, 33.3)).toBe(1647); // 1520 + 126.54
  });
});

describe('rates, expo and mixing', () => {
  it('rates give a weight per switch position', () => {
    // [dual-rates] the rate switch reduces the throw: 100 % at position 0, 70 % at position 1
    expect(channel(trainer, { 'aileron-stick': 100, 'rate-switch': 0 }, 1).value).toBe(100);
    expect(channel(trainer, { 'aileron-stick': 100, 'rate-switch': 1 }, 1).value).toBe(70);
  });

  it('expo and rates combine: 70 % of curve(0.5) with 30 % expo', () => {
    // [expo-cubic] 70 * 0.3875 = 27.125 %, pulse 1500 + 0.27125 * 500 = 1635.6 -> 1636
    const aileron = channel(trainer, { 'aileron-stick': 50, 'rate-switch': 1 }, 1);
    expect(aileron.value).toBeCloseTo(27.13, 2);
    expect(aileron.pulse_us).toBe(1636);
  });

  it('a mix with active counts only in its positions, and mixes add up', () => {
    // Demo channel 2: elevator 92 % plus flap-comp at flap positions 1 and 2, -3 % of the
    // switch value plus an offset of -3 %: mid flap -3 * 0 - 3 = -3, full -3 * 1 - 3 = -6.
    expect(channel(demo, { 'elevator-stick': 100, 'flap-switch': 0 }, 2).value).toBe(92);
    expect(channel(demo, { 'elevator-stick': 100, 'flap-switch': 1 }, 2).value).toBe(89);
    expect(channel(demo, { 'elevator-stick': 100, 'flap-switch': 2 }, 2).value).toBe(86);
  });

  it('offsets shift a mix', () => {
    // Demo nav-lights: 50 % of the light switch plus 50 %: 0, 50, 100.
    expect([0, 1, 2].map((p) => channel(demo, { 'light-switch': p }, 10).value)).toEqual([0, 50, 100]);
  });

  it('the sum is clamped to -100..100', () => {
    const text = readFixture('invalid/mix-saturates.yaml');
    const setup = setupOf(text);
    expect(channel(setup, { 'rudder-stick': 100, 'aileron-stick': 100 }, 4)).toMatchObject({
      value: 100,
      pulse_us: 2000,
    });
    expect(channel(setup, { 'rudder-stick': -100, 'aileron-stick': -100 }, 4)).toMatchObject({
      value: -100,
      pulse_us: 1000,
    });
  });
});

describe('cut', () => {
  it('overrides the stick while its switch is at the cut position', () => {
    expect(channel(trainer, { 'throttle-stick': 100, 'motor-arm': 0 }, 3)).toMatchObject({
      value: -100,
      pulse_us: 1000,
    });
    expect(channel(trainer, { 'throttle-stick': 100, 'motor-arm': 1 }, 3)).toMatchObject({
      value: 100,
      pulse_us: 2000,
    });
    expect(channel(trainer, { 'throttle-stick': 0, 'motor-arm': 1 }, 3)).toMatchObject({ value: 0, pulse_us: 1500 });
  });
});

describe('receiver pins', () => {
  it("carry their channel's pulse and their failsafe; the second receiver carries 9-16", () => {
    const out = evaluate(demo, { 'rudder-stick': 100 });
    const wing = out.receivers.find((r) => r.id === 'wing')!;
    expect(wing.pins.map((p) => p.ch)).toEqual([9, 10, 11, 12, 13, 14, 15, 16]);
    expect(wing.pins[0]).toEqual({ pin: 1, ch: 9, pulse_us: 1900, failsafe: 1500 });
    expect(wing.pins[1].failsafe).toBe('hold');
  });

  it('report an unset failsafe as null', () => {
    const setup = setupOf(readFixture('invalid/failsafe-unset.yaml'));
    const pin4 = evaluate(setup).receivers[0].pins.find((p) => p.pin === 4)!;
    expect(pin4.failsafe).toBeNull();
  });

  it('give the CLI JSON shape exactly', () => {
    const out = evaluate(trainer);
    expect(Object.keys(out)).toEqual(['channels', 'receivers']);
    expect(Object.keys(out.channels[0])).toEqual(['ch', 'function', 'value', 'pulse_us']);
    expect(Object.keys(out.receivers[0])).toEqual(['id', 'lost', 'pins']);
    expect(Object.keys(out.receivers[0].pins[0])).toEqual(['pin', 'ch', 'pulse_us', 'failsafe']);
  });
});

describe('mix curves', () => {
  it('sample the mix from -100 to +100 at the rates weight of the given position', () => {
    const at0 = mixCurve(trainer, 'aileron');
    expect(at0).toHaveLength(41);
    expect(at0[0]).toEqual({ x: -100, y: -100 });
    expect(at0[40]).toEqual({ x: 100, y: 100 });
    expect(at0[30].x).toBe(50);
    expect(at0[30].y).toBeCloseTo(38.75, 9); // [expo-cubic] 100 * 0.3875
    expect(mixCurve(trainer, 'aileron', 41, { 'rate-switch': 1 })[30].y).toBeCloseTo(27.125, 9);
    expect(mixCurve(trainer, 'nope')).toEqual([]);
  });
});

describe('channel extremes (mix-saturates)', () => {
  const mixes = (list: object[]) => setupSchema.parse(setupWith({ mixes: list })).mixes;
  const controls = controlsById(setupSchema.parse(setupWith({})).controls);

  it('finds the stick ends for a single mix', () => {
    const result = channelExtremes(mixes([{ id: 'a', from: 'stick', to: 1, weight: 120, expo: 40 }]), controls);
    expect(result.max.value).toBeCloseTo(120, 9);
    expect(result.min.value).toBeCloseTo(-120, 9);
    expect(result.max.setting).toEqual({ stick: 100 });
  });

  it('finds an extreme inside the stick travel when mixes of one stick pull against each other', () => {
    // x - x^3 peaks at x = 1/sqrt(3) with 2 / (3 sqrt(3)) = 0.3849 (calculus, worked by hand).
    const result = channelExtremes(
      mixes([
        { id: 'a', from: 'stick', to: 1, weight: 100 },
        { id: 'b', from: 'stick', to: 1, weight: -100, expo: 100 },
      ]),
      controls,
    );
    expect(result.max.value).toBeCloseTo((100 * 2) / (3 * Math.sqrt(3)), 9);
    expect(result.max.setting).toEqual({ stick: 58 });
  });

  it('enumerates switch positions for rates, active and switch inputs together', () => {
    const result = channelExtremes(
      mixes([
        { id: 'a', from: 'stick', to: 1, weight: 60, rates: { control: 'three', weights: [100, 40, 10] } },
        { id: 'b', from: 'three', to: 1, weight: 30, active: { control: 'two', positions: [1] } },
        { id: 'c', from: 'two', to: 1, weight: -20 },
      ]),
      controls,
    );
    // Best: stick +100 at rates position 0 (100), three at position 0 gives -30 only
    // when active; at two = 0 mix b is off and c gives +20: 100 + 20 = 120.
    expect(result.max.value).toBeCloseTo(120, 9);
    expect(result.max.setting).toEqual({ three: 0, two: 0, stick: 100 });
    expect(result.exact).toBe(true);
    expect(result.min.value).toBeCloseTo(-150, 9); // stick -100 (rates 100), b at three 0 (-30), c at two 1 (-20)
  });
});

function setupWith(extra: Record<string, unknown>): unknown {
  return {
    format: 'bindery-setup/1',
    model: { name: 'Bench rig', airframe: 'other' },
    link: { channels: 8 },
    controls: [
      { id: 'stick', kind: 'axis' },
      { id: 'three', kind: 'switch', positions: 3 },
      { id: 'two', kind: 'switch' },
    ],
    channels: [{ ch: 1, function: 'output', role: 'aux' }],
    receivers: [{ id: 'rx', outputs: 8, map: [{ pin: 1, ch: 1, failsafe: 1500 }] }],
    ...extra,
  };
}
