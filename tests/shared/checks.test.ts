import { describe, expect, it } from 'vitest';
import { analyzeSetup } from '@shared/analyze';
import { CATALOGUE } from '@shared/checks/run-checks';
import { invalidFixtures, validFixtures } from './setup-fixtures';

// docs/format.md's check catalogue, in its order: the contract for rule ids and severities.
const CONTRACT: [string, string][] = [
  ['syntax', 'error'],
  ['schema', 'error'],
  ['unknown-key', 'warning'],
  ['duplicate-id', 'error'],
  ['channel-shared', 'error'],
  ['channel-beyond-link', 'error'],
  ['pin-beyond-outputs', 'error'],
  ['function-unrouted', 'error'],
  ['pin-undriven', 'warning'],
  ['channel-undriven', 'warning'],
  ['unknown-control', 'error'],
  ['control-not-switch', 'error'],
  ['position-out-of-range', 'error'],
  ['mix-unplanned-target', 'warning'],
  ['mix-saturates', 'warning'],
  ['travel-order', 'error'],
  ['pulse-out-of-range', 'error'],
  ['telemetry-multiple', 'error'],
  ['telemetry-none', 'info'],
  ['primary-count', 'error'],
  ['failsafe-throttle', 'error'],
  ['failsafe-endstop', 'warning'],
  ['failsafe-unset', 'warning'],
  ['motor-without-cut', 'warning'],
  ['heavy-model-failsafe', 'error'],
  ['pair-split', 'warning'],
  ['primary-controls-on-secondary', 'warning'],
  ['power-double-supply', 'warning'],
  ['control-unused', 'info'],
  // Second edition of the safety model.
  ['failsafe-no-pulses', 'warning'],
  ['failsafe-payload', 'warning'],
  ['failsafe-mismatch', 'warning'],
  ['telemetry-on-secondary', 'warning'],
  ['primary-disabled-by-switch', 'warning'],
  ['cut-not-at-stop', 'warning'],
  // The project's addition: an accepted entry that names an error.
  ['accepted-error', 'error'],
  // Two accepted entries for one finding (the same rule and path).
  ['accepted-duplicate', 'warning'],
];

const invalid = invalidFixtures();
const valid = validFixtures();

describe('the check catalogue', () => {
  it('has exactly the checks of docs/format.md, with their severities, in order', () => {
    expect(CATALOGUE.map((check) => [check.id, check.severity])).toEqual(CONTRACT);
  });

  it('describes every check', () => {
    for (const check of CATALOGUE) expect(check.description.length).toBeGreaterThan(10);
  });

  it('has at least one invalid fixture per check', () => {
    const shown = new Set(invalid.map((fixture) => fixture.rule));
    expect(CONTRACT.map(([id]) => id).filter((id) => !shown.has(id))).toEqual([]);
  });
});

describe.each(invalid)('invalid fixture $name', (fixture) => {
  const analysis = analyzeSetup(fixture.text);

  it(`reports ${fixture.rule} at ${fixture.path || 'the text'}, line ${fixture.line}`, () => {
    const hits = analysis.findings.filter((finding) => finding.rule === fixture.rule);
    expect(hits.length).toBeGreaterThan(0);
    expect(hits.map((finding) => ({ path: finding.path, line: finding.line }))).toContainEqual({
      path: fixture.path,
      line: fixture.line,
    });
  });

  it('reports nothing else of weight than what it says comes along', () => {
    const others = analysis.findings
      .filter((finding) => finding.severity !== 'info' || finding.rule === fixture.rule)
      .map((finding) => finding.rule)
      .filter((rule) => rule !== fixture.rule);
    expect(others.filter((rule) => !fixture.also.includes(rule))).toEqual([]);
  });

  it('gives each finding a message, a hint and a position', () => {
    for (const finding of analysis.findings) {
      expect(finding.message).toMatch(/^\S.{10,}\.$/s);
      expect(finding.hint.length).toBeGreaterThan(5);
      expect(finding.line).toBeGreaterThanOrEqual(1);
      expect(finding.column).toBeGreaterThanOrEqual(1);
    }
  });
});

describe.each(valid)('valid fixture $name', (fixture) => {
  it('gives no findings at all', () => {
    const analysis = analyzeSetup(fixture.text);
    expect(analysis.findings).toEqual([]);
    expect(analysis.setup).not.toBeNull();
  });
});

describe('messages name the things involved', () => {
  const byName = new Map(invalid.map((fixture) => [fixture.name, analyzeSetup(fixture.text)]));
  const message = (name: string, rule: string) =>
    byName.get(name)!.findings.find((finding) => finding.rule === rule)!.message;

  it.each([
    ['channel-shared', 'channel-shared', 'Channel 4 carries both rudder and tow-release'],
    ['duplicate-id--map-pin', 'duplicate-id', 'pin 4 twice'],
    ['failsafe-throttle--pulse', 'failsafe-throttle', '1350 µs'],
    [
      'pair-split',
      'pair-split',
      'flap-left (channel 5) is on receiver cabin but flap-right (channel 6) is on receiver tail',
    ],
    ['unknown-control', 'unknown-control', 'yaw-stick'],
    ['mix-saturates', 'mix-saturates', '+130 % with aileron-stick at +100 % and rudder-stick at +100 %'],
    ['unknown-key', 'unknown-key', '"colour"'],
  ])('%s', (name, rule, words) => {
    expect(message(name, rule)).toContain(words);
  });
});

describe('findings', () => {
  it('are sorted by line and column', () => {
    for (const fixture of invalid) {
      const positions = analyzeSetup(fixture.text).findings.map((finding) => finding.line * 10_000 + finding.column);
      expect(positions).toEqual([...positions].sort((a, b) => a - b));
    }
  });

  it('are counted by severity', () => {
    const analysis = analyzeSetup(invalid.find((fixture) => fixture.name === 'heavy-model-failsafe')!.text);
    expect(analysis.counts).toEqual({ errors: 1, warnings: 1, infos: 0, accepted: 0 });
  });

  it('of unknown keys come with schema findings, and the unknown key is kept in the data', () => {
    const analysis = analyzeSetup('format: bindery-setup/1\nmodel: { name: X, airframe: kite, colour: red }\n');
    expect(analysis.findings.map((finding) => finding.rule)).toContain('unknown-key');
    expect(analysis.findings.map((finding) => finding.rule)).toContain('schema');
    expect(analysis.setup).toBeNull();
    expect((analysis.data as { model: { colour: string } }).model.colour).toBe('red');
  });
});
