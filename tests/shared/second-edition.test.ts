import { describe, expect, it } from 'vitest';
import { analyzeSetup } from '@shared/analyze';
import { changeFindings, outputsDelta } from '@shared/diff';
import { evaluate } from '@shared/evaluate/evaluate';
import { fromRest, restPositions } from '@shared/evaluate/rest';
import { stopPulse, throttleStop } from '@shared/evaluate/throttle-stop';
import type { Setup } from '@shared/format/schema';
import { readFixture } from './setup-fixtures';

// The second edition of the safety model (docs/format.md): stop pulse, rest, link loss per
// receiver, the new checks' edges and the compare that sees expo and rates. Pulses use
// the default travel 1000/1500/2000 [arduino-servo] and the cubic expo [expo-cubic].

const demoText = readFixture('valid/scale-16-channel-two-receivers.yaml');
const trainer = readFixture('valid/trainer-single-receiver.yaml');
const boatText = readFixture('valid/boat-centre-stop.yaml');

function setupOf(text: string): Setup {
  const analysis = analyzeSetup(text);
  if (!analysis.setup) throw new Error('not schema-valid');
  return analysis.setup;
}

function rules(text: string): string[] {
  return analyzeSetup(text).findings.map((finding) => finding.rule);
}

function swap(text: string, from: string, to: string): string {
  expect(text).toContain(from);
  return text.replace(from, to);
}

describe('rule 7: the stop pulse', () => {
  it('is the low end for an aeroplane, the high end when reversed, the centre for a car or boat', () => {
    const demo = setupOf(demoText);
    const motor = demo.channels.find((c) => c.role === 'throttle')!;
    expect(throttleStop(motor, demo)).toBe('low');
    expect(stopPulse(motor, demo)).toBe(1000);
    expect(stopPulse({ ...motor, travel: { ...motor.travel, reverse: true } }, demo)).toBe(2000);
    const boat = setupOf(boatText);
    expect(
      stopPulse(
        boat.channels.find((c) => c.role === 'throttle')!,
        boat,
      ),
    ).toBe(1500);
    // A boat without `stop` written still stops at the centre (common practice, docs/sources.md second edition).
    expect(throttleStop({ stop: undefined }, boat)).toBe('center');
  });

  it('refuses stop on a channel that is not a throttle', () => {
    const text = swap(
      demoText,
      'function: rudder,        role: rudder }',
      'function: rudder,        role: rudder, stop: low }',
    );
    expect(rules(text)).toContain('schema');
  });
});

describe('rule 8: at rest', () => {
  it('puts the throttle stick at its stop and leaves everything else at 0', () => {
    expect(restPositions(setupOf(demoText))).toEqual({ 'throttle-stick': -100 });
    expect(restPositions(setupOf(boatText))).toEqual({ 'throttle-trigger': 0 });
  });

  it('gives the idle pulse on the motor pin with the cut off, not half power', () => {
    const demo = setupOf(demoText);
    // Arm switch at position 1 (cut off); throttle at rest = -100 % -> 1000 µs. From
    // mid stick instead the motor would get 0 % -> 1500 µs, half power.
    const armed = evaluate(demo, fromRest(demo, { 'motor-arm': 1 }));
    expect(armed.channels.find((c) => c.ch === 3)).toMatchObject({ value: -100, pulse_us: 1000 });
    expect(evaluate(demo, { 'motor-arm': 1 }).channels.find((c) => c.ch === 3)?.pulse_us).toBe(1500);
  });
});

describe('rule 9: link loss per receiver', () => {
  const demo = setupOf(demoText);
  const pins = (lost: Parameters<typeof evaluate>[2], positions = {}) =>
    evaluate(demo, fromRest(demo, positions), lost).receivers.map((r) => ({
      id: r.id,
      lost: r.lost,
      pulses: r.pins.map((p) => p.pulse_us),
    }));

  it('loses only the named receiver: the wing sends its failsafes, the fuselage follows the sticks', () => {
    // Rudder stick at +50 %: fuselage pin 4 1500 + 0.5 * 500 = 1750 µs; the tailwheel
    // on wing pin 1 (80 %) would be 1500 + 0.4 * 500 = 1700 µs but fails safe to 1500.
    const out = pins(new Set(['wing']), { 'rudder-stick': 50 });
    expect(out[0]).toMatchObject({ id: 'fuselage', lost: false });
    expect(out[0].pulses[3]).toBe(1750);
    // Wing pins: 1500, hold (nav lights at rest, 0 % -> 1500), hold (landing -100 % -> 1000),
    // hold (tanks 1000, 1000), hold (canopy 1000), 1500, 1500.
    expect(out[1]).toEqual({ id: 'wing', lost: true, pulses: [1500, 1500, 1000, 1000, 1000, 1000, 1500, 1500] });
  });

  it('sends nothing for off and for an unset failsafe, and the held pulse for hold', () => {
    const text = swap(
      swap(demoText, '{ pin: 7, ch: 15, failsafe: 1500 }', '{ pin: 7, ch: 15, failsafe: off }'),
      '{ pin: 8, ch: 16, failsafe: 1500 }',
      '{ pin: 8, ch: 16 }',
    );
    const setup = setupOf(text);
    // Canopy switch at 1 when the link goes: wing pin 6 holds 2000 µs.
    const wing = evaluate(setup, fromRest(setup, { 'canopy-switch': 1 }), 'all').receivers[1];
    expect(wing.pins.map((p) => [p.pin, p.pulse_us, p.failsafe])).toEqual([
      [1, 1500, 1500],
      [2, 1500, 'hold'],
      [3, 1000, 'hold'],
      [4, 1000, 'hold'],
      [5, 1000, 'hold'],
      [6, 2000, 'hold'],
      [7, null, 'off'],
      [8, null, null],
    ]);
  });
});

describe('the new checks at their edges', () => {
  const motorPin = '      - { pin: 3, ch: 3, failsafe: 1000 }   # motor stops on signal loss';
  const withMotor = (by: string, text = trainer) => rules(swap(text, motorPin, by));

  it('failsafe-throttle measures from the centre, both ways, for a centre stop', () => {
    const centre = swap(trainer, 'role: throttle,', 'role: throttle, stop: center,').replace('value: -100', 'value: 0');
    // 1500 +- 50 µs is allowed; 51 µs either side is power (common practice, no published source).
    expect(withMotor('      - { pin: 3, ch: 3, failsafe: 1450 }', centre)).not.toContain('failsafe-throttle');
    expect(withMotor('      - { pin: 3, ch: 3, failsafe: 1550 }', centre)).not.toContain('failsafe-throttle');
    expect(withMotor('      - { pin: 3, ch: 3, failsafe: 1449 }', centre)).toContain('failsafe-throttle');
    expect(withMotor('      - { pin: 3, ch: 3, failsafe: 1551 }', centre)).toContain('failsafe-throttle');
    // 1000 µs on a centre stop is full reverse.
    expect(withMotor(motorPin, centre)).toContain('failsafe-throttle');
  });

  it('failsafe-throttle calls off an error on a fuel or turbine engine, a warning on an electric one', () => {
    const off = '      - { pin: 3, ch: 3, failsafe: off }';
    for (const motor of ['fuel', 'turbine']) {
      const text = swap(trainer, '  airframe: airplane', `  airframe: airplane\n  motor: ${motor}`);
      expect(withMotor(off, text)).toContain('failsafe-throttle');
    }
    expect(withMotor(off)).toEqual(['failsafe-no-pulses']);
  });

  it('cut-not-at-stop allows 10 µs: -98 % (1010 µs) is at the stop, -97 % (1015 µs) is not', () => {
    // 1500 - 0.98 * 500 = 1010 µs; 1500 - 0.97 * 500 = 1015 µs.
    expect(rules(trainer.replace('value: -100', 'value: -98'))).not.toContain('cut-not-at-stop');
    expect(rules(trainer.replace('value: -100', 'value: -97'))).toContain('cut-not-at-stop');
  });

  it('failsafe-payload allows 25 µs from the at-rest pulse and hold', () => {
    const payload = readFixture('invalid/failsafe-payload.yaml');
    const pin = '      - { pin: 5, ch: 5, failsafe: 2000 }   # <-';
    // The drop switch rests at position 0: -100 % -> 1000 µs.
    expect(rules(swap(payload, pin, '      - { pin: 5, ch: 5, failsafe: 1025 }'))).not.toContain('failsafe-payload');
    expect(rules(swap(payload, pin, '      - { pin: 5, ch: 5, failsafe: 1026 }'))).toContain('failsafe-payload');
    expect(rules(swap(payload, pin, '      - { pin: 5, ch: 5, failsafe: hold }'))).not.toContain('failsafe-payload');
  });

  it('failsafe-mismatch allows 10 µs between ganged pins', () => {
    const ganged = readFixture('invalid/failsafe-mismatch.yaml');
    const pin = '      - { pin: 1, ch: 1, failsafe: 1300 }   # <-';
    expect(rules(swap(ganged, pin, '      - { pin: 1, ch: 1, failsafe: 1510 }'))).not.toContain('failsafe-mismatch');
    expect(rules(swap(ganged, pin, '      - { pin: 1, ch: 1, failsafe: 1511 }'))).toContain('failsafe-mismatch');
    expect(rules(swap(ganged, pin, '      - { pin: 1, ch: 1, failsafe: hold }'))).toContain('failsafe-mismatch');
  });

  it('primary-disabled-by-switch finds a zero rate and a stick mix switched off in some position', () => {
    const zero = swap(trainer, 'weights: [100, 70]', 'weights: [100, 0]');
    expect(rules(zero)).toContain('primary-disabled-by-switch');
    const gated = swap(
      trainer,
      '  - { id: rudder,   from: rudder-stick,   to: 4 }',
      '  - { id: rudder,   from: rudder-stick,   to: 4, active: { control: rate-switch, positions: [0] } }',
    );
    expect(analyzeSetup(gated).findings.find((f) => f.rule === 'primary-disabled-by-switch')?.message).toContain(
      'rate-switch at position 1',
    );
  });

  it('failsafe-endstop leaves mode channels alone', () => {
    expect(rules(readFixture('valid/multirotor-mode-return-home.yaml'))).toEqual([]);
  });
});

describe('accepted findings', () => {
  it('are reported apart, with their reason, and not counted as open', () => {
    const text = `${swap(trainer, '      - { pin: 4, ch: 4, failsafe: 1500 }', '      - { pin: 4, ch: 4 }')}accepted:\n  - { rule: failsafe-unset, path: "receivers[id=cabin].map[pin=4]", reason: The rudder servo centres itself }\n`;
    const analysis = analyzeSetup(text);
    expect(analysis.findings).toMatchObject([
      { rule: 'failsafe-unset', severity: 'warning', accepted: 'The rudder servo centres itself' },
    ]);
    expect(analysis.counts).toEqual({ errors: 0, warnings: 0, infos: 0, accepted: 1 });
  });
});

describe('the compare sees expo and rates (the demo revisions)', () => {
  const demo = setupOf(demoText);

  it('reports the elevator expo change 15 -> 20 where the stick is off centre', () => {
    const after = setupOf(swap(demoText, 'weight: 92, expo: 15', 'weight: 92, expo: 20'));
    const delta = outputsDelta(demo, after);
    // -50 % stick: 92 * (0.85 * -0.5 + 0.15 * -0.125) = -40.825 % -> 1295.875 -> 1296 µs;
    // 92 * (0.8 * -0.5 + 0.2 * -0.125) = -39.1 % -> 1304.5 -> 1305 µs. The ends do not move
    // (curve(+-1) = +-1), so sampling only the ends and centre saw nothing.
    expect(delta[0]).toMatchObject({ receiver: 'fuselage', pin: 2, before_us: 1296, after_us: 1305 });
    // One entry per flap position: flap-comp adds -3 % (mid) and -6 % (full) on top.
    expect(delta.map((row) => row.position.set['flap-switch'])).toEqual([0, 1, 2]);
  });

  it('reports the low-rate change 60 -> 65 with the rate switch at its low position', () => {
    const after = setupOf(demoText.replaceAll('weights: [100, 60]', 'weights: [100, 65]'));
    expect(
      outputsDelta(demo, after).map((row) => [row.receiver, row.pin, row.position.set, row.before_us, row.after_us]),
    ).toEqual([
      // 1500 - 0.60 * 500 = 1200 µs, 1500 - 0.65 * 500 = 1175 µs; pin 6 is reversed: 1800 -> 1825.
      ['fuselage', 1, { 'rate-switch': 1, 'aileron-stick': -100 }, 1200, 1175],
      ['fuselage', 6, { 'rate-switch': 1, 'aileron-stick': -100 }, 1800, 1825],
    ]);
  });

  it('reports a receiver lost with a pulse against hold where the held pulse differs', () => {
    const after = setupOf(swap(demoText, '{ pin: 6, ch: 14, failsafe: hold }', '{ pin: 6, ch: 14, failsafe: 1000 }'));
    // The canopy rests at 1000 µs, so hold and 1000 agree at rest; with the canopy switch
    // at 1 the held pulse is 2000 µs.
    expect(outputsDelta(demo, after)).toMatchObject([
      {
        kind: 'failsafe',
        receiver: 'wing',
        pin: 6,
        position: { set: { 'canopy-switch': 1 }, lost: ['wing'] },
        before_us: 2000,
        after_us: 1000,
      },
    ]);
  });
});

describe('change findings', () => {
  it('warn when a channel is reversed and a pin keeps its failsafe number, not for a centre pulse', () => {
    const demo = setupOf(demoText);
    const reversedMotor = setupOf(swap(demoText, 'role: throttle,', 'role: throttle, travel: { reverse: true },'));
    expect(changeFindings(demo, reversedMotor)).toMatchObject([
      { rule: 'failsafe-meaning-changed', severity: 'warning', path: 'receivers[id=fuselage].map[pin=3].failsafe' },
    ]);
    // The tailwheel fails safe to 1500 µs, the centre through either travel.
    const reversedTailwheel = setupOf(
      swap(demoText, 'role: steering }', 'role: steering, travel: { reverse: true } }'),
    );
    expect(changeFindings(demo, reversedTailwheel)).toEqual([]);
  });
});
