import { describe, expect, it } from 'vitest';
import { analyzeSetup } from '@shared/analyze';
import { readFixture } from './setup-fixtures';

// The numeric edges of the checks, on the trainer fixture with one value changed.
const trainer = readFixture('valid/trainer-single-receiver.yaml');

function rulesWith(replace: string, by: string): string[] {
  expect(trainer).toContain(replace);
  return analyzeSetup(trainer.replace(replace, by)).findings.map((finding) => finding.rule);
}

const aileronPin = '      - { pin: 1, ch: 1, failsafe: 1500 }';
const motorPin = '      - { pin: 3, ch: 3, failsafe: 1000 }   # motor stops on signal loss';
const motorChannel = '  - { ch: 3, function: motor,    role: throttle,';

describe('pulse-out-of-range', () => {
  // [arduino-servo] many servos respond to 700-2300 microseconds
  it.each([
    [699, true],
    [700, false],
    [2300, false],
    [2301, true],
  ])('a failsafe of %i us is out of range: %s', (pulse, fires) => {
    expect(rulesWith(aileronPin, `      - { pin: 1, ch: 1, failsafe: ${pulse} }`).includes('pulse-out-of-range')).toBe(
      fires,
    );
  });

  it.each([
    ['low_us: 699', true],
    ['low_us: 700', false],
    ['high_us: 2300', false],
    ['high_us: 2301', true],
  ])('a travel with %s is out of range: %s', (field, fires) => {
    const rules = rulesWith(
      '  - { ch: 1, function: aileron,  role: aileron }',
      `  - { ch: 1, function: aileron,  role: aileron, travel: { ${field} } }`,
    );
    expect(rules.includes('pulse-out-of-range')).toBe(fires);
  });
});

describe('failsafe-throttle', () => {
  // [cap-658] the throttle must go to closed or idle on signal loss; Bindery allows 50 µs of slack.
  it.each([
    [1050, false],
    [1051, true],
    [980, false],
  ])('a throttle failsafe of %i us (idle 1000 µs) fires: %s', (pulse, fires) => {
    expect(rulesWith(motorPin, `      - { pin: 3, ch: 3, failsafe: ${pulse} }`).includes('failsafe-throttle')).toBe(
      fires,
    );
  });

  it('measures toward full power from the idle end of a reversed travel', () => {
    const reversed = trainer.replace(motorChannel, `${motorChannel} travel: { reverse: true },`);
    const at = (pulse: number) =>
      analyzeSetup(reversed.replace(motorPin, `      - { pin: 3, ch: 3, failsafe: ${pulse} }`)).findings.map(
        (f) => f.rule,
      );
    expect(at(1950)).not.toContain('failsafe-throttle');
    expect(at(1949)).toContain('failsafe-throttle');
    expect(at(1000)).toContain('failsafe-throttle');
  });

  it('lets an electric throttle fail safe to off (no pulses), with a warning to test it', () => {
    // Many speed controllers stop without pulses, not all: common practice (docs/sources.md, second edition).
    expect(rulesWith(motorPin, '      - { pin: 3, ch: 3, failsafe: off }')).toEqual(['failsafe-no-pulses']);
  });
});

describe('failsafe-endstop', () => {
  it.each([
    [1025, true],
    [1026, false],
    [1974, false],
    [1975, true],
  ])('an aileron failsafe of %i us (travel 1000-2000) warns: %s', (pulse, fires) => {
    expect(rulesWith(aileronPin, `      - { pin: 1, ch: 1, failsafe: ${pulse} }`).includes('failsafe-endstop')).toBe(
      fires,
    );
  });
});

describe('heavy-model-failsafe', () => {
  // [cap-658] a failsafe is an absolute requirement for models over 7 kg
  const unset = (weight: number) =>
    analyzeSetup(
      trainer.replace('weight_g: 2400', `weight_g: ${weight}`).replace(motorPin, '      - { pin: 3, ch: 3 }'),
    ).findings.map((f) => f.rule);

  it('applies above 7000 g only', () => {
    expect(unset(7000)).not.toContain('heavy-model-failsafe');
    expect(unset(7001)).toContain('heavy-model-failsafe');
    expect(unset(7001)).toContain('failsafe-unset');
  });
});

describe('mix-saturates', () => {
  it('stays quiet at exactly 100 % and warns just past it', () => {
    const coupled = (weight: number) =>
      rulesWith(
        '  - { id: rudder,   from: rudder-stick,   to: 4 }',
        `  - { id: rudder,   from: rudder-stick,   to: 4, weight: 80 }\n  - { id: coupling, from: aileron-stick, to: 4, weight: ${weight} }`,
      );
    expect(coupled(20)).not.toContain('mix-saturates');
    expect(coupled(20.5)).toContain('mix-saturates');
  });
});
