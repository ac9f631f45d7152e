import { describe, expect, it } from 'vitest';
import type { Finding } from '../../shared/findings';
import type { Setup } from '../../shared/format/schema';
import { compareRevisions, findingsDelta, outputsDelta, standardPositions } from '../../shared/diff';
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
    expect(where(delta.resolved)).toEqual(
      [9, 10, 11, 12, 13, 14, 15, 16].map((ch) => `function-unrouted channels[ch=${ch}]`),
    );
    expect(where(delta.introduced)).toEqual(['failsafe-endstop receivers[id=wing].map[pin=3].failsafe']);
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
  it('lists the standard positions: rest, each axis at both ends, each switch in each other position', () => {
    const { before, after } = setups('trim-tuning');
    const labels = standardPositions(before, after).map((position) => position.label);
    expect(labels[0]).toBe('at rest (axes centred, switches at position 0)');
    expect(labels).toContain('aileron-stick at -100 %');
    expect(labels).toContain('aileron-stick at +100 %');
    expect(labels).toContain('flap-switch at position 1');
    expect(labels).toContain('flap-switch at position 2');
    expect(labels).not.toContain('flap-switch at position 0');
    // 4 axes x 2 ends + flap 2 + gear, rates, arm, lights 1 each, plus rest.
    expect(labels).toHaveLength(1 + 8 + 2 + 4);
  });

  it('reports the failsafe fix as the one pin that behaves differently, on signal loss only', () => {
    const { before, after } = setups('failsafe-fix');
    expect(outputsDelta(before, after)).toEqual([
      {
        kind: 'failsafe',
        position: { label: 'on signal loss', set: {} },
        receiver: 'wing',
        pin: 3,
        ch_before: 11,
        ch_after: 11,
        before_us: 988,
        after_us: 1500,
        summary: 'Wing receiver pin 3, on signal loss: 988 us -> 1500 us',
      },
    ]);
  });

  it('reports the remapped pins of the second receiver with the pulses of their new channels', () => {
    const { before, after } = setups('remap-second-receiver');
    const delta = outputsDelta(before, after);
    expect(delta.every((row) => row.receiver === 'wing' && row.kind === 'pulse')).toBe(true);
    expect(new Set(delta.map((row) => row.pin))).toEqual(new Set([1, 2, 3, 4, 5, 6, 7, 8]));
    // At rest pin 1 followed the aileron (centred, 1500 us); now the tow release, its
    // 2-position switch at position 0, sits at the low end (1000 us) [arduino-servo].
    expect(delta.find((row) => row.pin === 1 && row.position.label.startsWith('at rest'))).toMatchObject({
      ch_before: 1,
      ch_after: 9,
      before_us: 1500,
      after_us: 1000,
    });
    // Full right aileron moved wing pin 1 before (expo does not change the end point:
    // curve(1) = 1 [expo-cubic]); now pin 1 ignores the stick and stays at 1000 us.
    expect(delta.find((row) => row.pin === 1 && row.position.label === 'aileron-stick at +100 %')).toMatchObject({
      before_us: 2000,
      after_us: 1000,
    });
    // The fuselage receiver is untouched, so none of its pins shows up.
    expect(delta.some((row) => row.receiver === 'fuselage')).toBe(false);
  });

  it('shows a mix change only where it changes a pulse', () => {
    const { before, after } = setups('trim-tuning');
    // Flap trim -8 -> -12 % on the elevator channel (ch 2) with the stick centred and
    // the flap switch fully down: -8 % of 500 us is -40 us, -12 % is -60 us from the
    // 1500 us centre (docs/format.md evaluation, default travel [arduino-servo]). The rates
    // and expo changes do not show at these positions: rates need the rate switch and
    // the stick moved together, and expo does not change the end points [expo-cubic].
    expect(
      outputsDelta(before, after).map((row) => [
        row.position.label,
        row.receiver,
        row.pin,
        row.before_us,
        row.after_us,
      ]),
    ).toEqual([['flap-switch at position 2', 'main', 2, 1460, 1440]]);
  });

  it('exercises a renamed control under its new name on both sides: the renames pair changes no pulse', () => {
    const { before, after } = setups('renames');
    expect(outputsDelta(before, after)).toEqual([]);
  });

  it('lists an added receiver pin at rest and where it moves, not at every position', () => {
    const { before, after } = setups('receiver-added');
    expect(
      outputsDelta(before, after).map((row) => [
        row.position.label,
        row.receiver,
        row.pin,
        row.before_us,
        row.after_us,
      ]),
    ).toEqual([
      ['at rest (axes centred, switches at position 0)', 'tail', 1, null, 1000],
      ['release-switch at position 1', 'tail', 1, null, 2000],
    ]);
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
