import { describe, expect, it } from 'vitest';
import type { Finding } from '@shared/findings';
import type { Setup } from '@shared/format/schema';
import { compareRevisions, findingsDelta, outputsDelta, REST_LABEL } from '@shared/diff';
import { loadPair } from './diff-pairs';

const where = (findings: Finding[]) => findings.map((finding) => `${finding.rule} ${finding.path}`);

function setups(name: Parameters<typeof loadPair>[0]): { before: Setup; after: Setup } {
  const { before, after } = loadPair(name);
  if (!before.setup || !after.setup) throw new Error(`fixture pair ${name} is not schema-valid`);
  return { before: before.setup, after: after.setup };
}

describe('findings delta', () => {
  it('shows the remap resolving the unrouted channels and introducing the left-over failsafe', () => {
    const { before, after } = loadPair('remap-second-receiver');
    const delta = findingsDelta(before.findings, after.findings);
    // Before the remap the wing receiver's pin 3 carried the motor too, failing safe to
    // 988 µs against the fuselage's 1000 µs (failsafe-mismatch, more than 10 µs apart).
    expect(where(delta.resolved).sort()).toEqual(
      [
        'failsafe-mismatch receivers[id=wing].map[pin=3].failsafe',
        ...[9, 10, 11, 12, 13, 14, 15, 16].map((ch) => `function-unrouted channels[ch=${ch}]`),
      ].sort(),
    );
    // After it, the left-over 988 µs sits on an aux channel, and the tow release and the
    // smoke (payloads, at rest at 1000 µs) fail safe to 1500 µs, which would release them.
    expect(where(delta.introduced).sort()).toEqual([
      'failsafe-endstop receivers[id=wing].map[pin=3].failsafe',
      'failsafe-payload receivers[id=wing].map[pin=1].failsafe',
      'failsafe-payload receivers[id=wing].map[pin=6].failsafe',
    ]);
  });

  it('shows the failsafe fix resolving the warning and introducing nothing', () => {
    const { before, after } = loadPair('failsafe-fix');
    const delta = findingsDelta(before.findings, after.findings);
    expect(where(delta.resolved)).toEqual(['failsafe-endstop receivers[id=wing].map[pin=3].failsafe']);
    expect(delta.introduced).toEqual([]);
  });

  it('matches by rule and path, not by line or message, and counts repeats', () => {
    const finding = (rule: string, path: string, line: number, message = 'm'): Finding => ({
      rule,
      severity: 'warning',
      message,
      hint: 'h',
      path,
      line,
      column: 1,
    });
    const before = [finding('a', 'x', 3), finding('b', 'y', 4), finding('b', 'y', 9)];
    const after = [finding('a', 'x', 30, 'other words'), finding('b', 'y', 5), finding('c', 'z', 6)];
    const delta = findingsDelta(before, after);
    expect(delta.introduced).toEqual([after[2]]);
    expect(delta.resolved).toEqual([before[2]]);
  });
});

describe('outputs delta', () => {
  const rows = (before: Setup, after: Setup) =>
    outputsDelta(before, after).map((row) => [row.position.label, row.receiver, row.pin, row.before_us, row.after_us]);

  it('reports the failsafe fix as the one pin that behaves differently, with its receiver lost only', () => {
    const { before, after } = setups('failsafe-fix');
    expect(outputsDelta(before, after)).toEqual([
      {
        kind: 'failsafe',
        position: { label: `${REST_LABEL}, Wing receiver lost`, set: {}, lost: ['wing'] },
        receiver: 'wing',
        pin: 3,
        ch_before: 11,
        ch_after: 11,
        before_us: 988,
        after_us: 1500,
        failsafe_before: 988,
        failsafe_after: 1500,
        summary: `Wing receiver pin 3, ${REST_LABEL}, Wing receiver lost: 988 µs -> 1500 µs`,
      },
    ]);
  });

  it('reports the remapped pins of the second receiver with the pulses of their new channels', () => {
    const { before, after } = setups('remap-second-receiver');
    const delta = outputsDelta(before, after);
    expect(delta.every((row) => row.receiver === 'wing')).toBe(true);
    expect(new Set(delta.map((row) => row.pin))).toEqual(new Set([1, 2, 3, 4, 5, 6, 7, 8]));
    // At rest pin 1 followed the aileron (centred, 1500 µs); now the tow release, its
    // 2-position switch at position 0, sits at the low end (1000 µs) [arduino-servo].
    expect(delta.find((row) => row.pin === 1 && row.position.label === REST_LABEL)).toMatchObject({
      kind: 'pulse',
      ch_before: 1,
      ch_after: 9,
      before_us: 1500,
      after_us: 1000,
    });
    // The fuselage receiver is untouched, so none of its pins shows up.
    expect(delta.some((row) => row.receiver === 'fuselage')).toBe(false);
  });

  it('shows every mix change, in the switch positions where it counts', () => {
    const { before, after } = setups('trim-tuning');
    // Default travel 1000/1500/2000 [arduino-servo], cubic expo [expo-cubic].
    expect(rows(before, after)).toEqual([
      // Low rate 65 -> 70 % of full stick on both ailerons: at -100 % curve(-1) = -1, so
      // 1500 - 0.65 * 500 = 1175 µs before, 1500 - 0.70 * 500 = 1150 µs after.
      ['rate-switch at position 1, aileron-stick at -100 %, the rest at rest', 'main', 1, 1175, 1150],
      // Elevator expo: the first point of the grid (centre out) where the pulses differ.
      ['elevator-stick at -50 %, the rest at rest', 'main', 2, 1309, 1326],
      ['flap-switch at position 1, elevator-stick at -50 %, the rest at rest', 'main', 2, 1309, 1326],
      // Flap trim -8 -> -12 % with the stick centred and the flaps fully down: -8 % of
      // 500 µs is -40 µs, -12 % is -60 µs from the 1500 µs centre.
      ['flap-switch at position 2, the rest at rest', 'main', 2, 1460, 1440],
      ['rate-switch at position 1, aileron-stick at -100 %, the rest at rest', 'main', 6, 1175, 1150],
    ]);
  });

  it('exercises a renamed control under its new name on both sides: the renames pair changes no pulse', () => {
    const { before, after } = setups('renames');
    expect(outputsDelta(before, after)).toEqual([]);
  });

  it('is empty for a reordered setup and for a revision compared with itself', () => {
    const { before, after } = setups('reorder');
    expect(outputsDelta(before, after)).toEqual([]);
    expect(outputsDelta(after, after)).toEqual([]);
  });

  it('lists an added receiver pin once, at rest', () => {
    const { before, after } = setups('receiver-added');
    expect(rows(before, after)).toEqual([[REST_LABEL, 'tail', 1, null, 1000]]);
  });
});

describe('compareRevisions', () => {
  it('puts the semantic diff, both deltas and the text diff together', () => {
    const { before, after } = loadPair('failsafe-fix');
    const comparison = compareRevisions(before, after);
    expect(comparison.counts.changed).toBe(1);
    expect(comparison.changes[0].path).toBe('receivers[id=wing].map[pin=3].failsafe');
    expect(where(comparison.findings_delta.resolved)).toEqual([
      'failsafe-endstop receivers[id=wing].map[pin=3].failsafe',
    ]);
    expect(comparison.outputs_delta).toHaveLength(1);
    expect(comparison.text.added).toBeGreaterThan(0);
    expect(JSON.parse(JSON.stringify(comparison))).toEqual(comparison);
  });

  it('has no outputs delta when a side is not schema-valid, and still diffs it', () => {
    const { before } = loadPair('failsafe-fix');
    const text = before.text.replace('channels: 16', 'channels: lots');
    const broken = { text, data: { ...(before.data as object), link: { channels: 'lots' } }, findings: [] };
    const comparison = compareRevisions(before, broken);
    expect(comparison.outputs_delta).toBeNull();
    expect(comparison.changes).toMatchObject([{ path: 'link.channels', before: 16, after: 'lots' }]);
  });
});
