import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { pairFile } from './diff-pairs';

const root = fileURLToPath(new URL('../..', import.meta.url));

function run(...args: string[]) {
  const result = spawnSync('npx', ['tsx', 'scripts/cli/diff.ts', ...args], { cwd: root, encoding: 'utf8' });
  return { code: result.status, stdout: result.stdout, stderr: result.stderr };
}

// Each run starts tsx through npx (about 1.5 s), so these tests get a longer timeout.
describe('npm run diff (scripts/cli/diff.ts)', { timeout: 60_000 }, () => {
  it('prints the changes and counts as one JSON object with --json and exits 0', () => {
    const result = run(pairFile('failsafe-fix', 'before'), pairFile('failsafe-fix', 'after'), '--json');
    expect(result.code).toBe(0);
    expect(JSON.parse(result.stdout)).toMatchObject({
      changes: [
        {
          kind: 'changed',
          path: 'receivers[id=wing].map[pin=3].failsafe',
          before: 988,
          after: 1500,
          summary: 'Wing receiver pin 3: failsafe 988 -> 1500 µs',
        },
      ],
      counts: { added: 0, removed: 0, changed: 1, renamed: 0, moved: 0 },
    });
  });

  it('gives every change exactly the contract fields', () => {
    const result = run(pairFile('receiver-added', 'before'), pairFile('receiver-added', 'after'), '--json');
    expect(result.code).toBe(0);
    const out = JSON.parse(result.stdout);
    expect(Object.keys(out).sort()).toEqual([
      'change_findings',
      'changes',
      'counts',
      'findings_delta',
      'outputs_delta',
    ]);
    for (const change of out.changes)
      expect(Object.keys(change).sort()).toEqual(['after', 'before', 'kind', 'path', 'summary']);
    expect(out.counts).toEqual({ added: 4, removed: 0, changed: 1, renamed: 0, moved: 0 });
  });

  it('prints one change a line, then the counts, without --json', () => {
    const result = run(pairFile('renames', 'before'), pairFile('renames', 'after'));
    expect(result.code).toBe(0);
    const lines = result.stdout.trimEnd().split('\n');
    expect(lines).toHaveLength(6 + 2);
    expect(lines[0]).toContain('Control gear-switch renamed to retract-switch');
    expect(lines[lines.length - 1]).toBe('6 changes: 0 added, 0 removed, 3 changed, 3 renamed, 0 moved');
  });

  it('exits 0 for schema-invalid but readable files', () => {
    const dir = mkdtempSync(join(tmpdir(), 'bindery-diff-'));
    const file = join(dir, 'odd.yaml');
    writeFileSync(file, 'format: something-else\nmodel: 3\n');
    const result = run(pairFile('renames', 'before'), file, '--json');
    expect(result.code).toBe(0);
    expect(JSON.parse(result.stdout).counts.changed).toBeGreaterThan(0);
  });

  it('exits 2 for a missing file, a folder, unreadable YAML and bad arguments', () => {
    const dir = mkdtempSync(join(tmpdir(), 'bindery-diff-'));
    const broken = join(dir, 'broken.yaml');
    writeFileSync(broken, 'receivers: [1,\n');
    const good = pairFile('renames', 'before');
    for (const args of [
      [join(dir, 'missing.yaml'), good],
      [dir, good],
      [good, broken],
      [good],
      [good, good, '--colour'],
    ]) {
      const result = run(...args);
      expect(result.code, args.join(' ')).toBe(2);
      expect(result.stdout).toBe('');
      expect(result.stderr.length).toBeGreaterThan(0);
    }
    const json = run(join(dir, 'missing.yaml'), good, '--json');
    expect(json.code).toBe(2);
    expect(JSON.parse(json.stdout).error.message).toContain('missing.yaml');
  });

  // The demo revisions of issue 11: only the elevator expo (15 -> 20), or only the low
  // aileron rate (60 -> 65), changed. Both move pins inside the stick's range, which the
  // compare must report (docs/format.md, "The compare sees every change in behaviour").
  it('shows a non-empty outputs_delta for a pair differing only in an expo, or only in a low rate', () => {
    const dir = mkdtempSync(join(tmpdir(), 'bindery-diff-'));
    const demo = readFileSync(
      fileURLToPath(new URL('../../fixtures/valid/scale-16-channel-two-receivers.yaml', import.meta.url)),
      'utf8',
    );
    const write = (name: string, text: string) => {
      const file = join(dir, name);
      writeFileSync(file, text);
      return file;
    };
    const base = write('demo.yaml', demo);
    const expo = write('expo.yaml', demo.replace('weight: 92, expo: 15', 'weight: 92, expo: 20'));
    const lowRate = write('low-rate.yaml', demo.replaceAll('weights: [100, 60]', 'weights: [100, 65]'));

    const expoRun = run(base, expo, '--json');
    expect(expoRun.code).toBe(0);
    const expoOut = JSON.parse(expoRun.stdout);
    expect(expoOut.changes.map((change: { path: string }) => change.path)).toEqual(['mixes[id=elevator].expo']);
    expect(expoOut.outputs_delta.length).toBeGreaterThan(0);
    // [expo-cubic] -50 % stick: 92 * (0.85 * -0.5 + 0.15 * -0.125) = -40.825 % -> 1296 us,
    // 92 * (0.8 * -0.5 + 0.2 * -0.125) = -39.1 % -> 1305 us.
    expect(expoOut.outputs_delta[0]).toMatchObject({ receiver: 'fuselage', pin: 2, before_us: 1296, after_us: 1305 });
    expect(expoOut.findings_delta).toEqual({ introduced: [], resolved: [] });
    expect(expoOut.change_findings).toEqual([]);

    const rateRun = run(base, lowRate, '--json');
    expect(rateRun.code).toBe(0);
    const rateOut = JSON.parse(rateRun.stdout);
    expect(rateOut.outputs_delta.length).toBeGreaterThan(0);
    // 1500 - 0.60 * 500 = 1200 us before, 1500 - 0.65 * 500 = 1175 us after, at the low rate.
    expect(rateOut.outputs_delta[0]).toMatchObject({
      receiver: 'fuselage',
      pin: 1,
      position: { set: { 'rate-switch': 1, 'aileron-stick': -100 } },
      before_us: 1200,
      after_us: 1175,
    });
  });
});
