import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
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
});
