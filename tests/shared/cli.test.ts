import { spawn } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { FIXTURES_DIR, invalidFixtures, validFixtures } from './setup-fixtures';

// The check and outputs commands, run as a user runs them (docs/format.md, "Command line").
const ROOT = fileURLToPath(new URL('../../', import.meta.url));

interface Run {
  code: number | null;
  stdout: string;
  stderr: string;
}

function run(script: 'check' | 'outputs', args: string[]): Promise<Run> {
  return new Promise((resolve, reject) => {
    const child = spawn('npx', ['tsx', `scripts/cli/${script}.ts`, ...args], { cwd: ROOT });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (chunk) => (stdout += chunk));
    child.stderr.on('data', (chunk) => (stderr += chunk));
    child.on('error', reject);
    child.on('close', (code) => resolve({ code, stdout, stderr }));
  });
}

const fixture = (relative: string) => `${FIXTURES_DIR}${relative}`;
const TIMEOUT = 120_000;

describe('check', () => {
  it(
    'exits 0 on every valid fixture and 1 on every invalid fixture with errors, printing one JSON object',
    async () => {
      const cases = [
        ...validFixtures().map((f) => ({ file: f.file, code: 0 })),
        ...[
          'schema',
          'syntax',
          'syntax--not-a-mapping',
          'channel-shared',
          'failsafe-throttle',
          'mix-saturates',
          'telemetry-none',
        ].map((name) => ({
          file: fixture(`invalid/${name}.yaml`),
          code: ['mix-saturates', 'telemetry-none'].includes(name) ? 0 : 1,
        })),
      ];
      const runs = await Promise.all(cases.map((c) => run('check', [c.file, '--json'])));
      runs.forEach((result, i) => {
        expect({ file: cases[i].file, code: result.code }).toEqual({ file: cases[i].file, code: cases[i].code });
        const out = JSON.parse(result.stdout);
        expect(Object.keys(out)).toEqual(['findings', 'errors', 'warnings', 'infos']);
        expect(out.errors > 0).toBe(cases[i].code === 1);
        for (const finding of out.findings) {
          expect(Object.keys(finding)).toEqual(['rule', 'severity', 'message', 'hint', 'path', 'line', 'column']);
        }
      });
    },
    TIMEOUT,
  );

  it(
    'prints one finding a line and a summary without --json',
    async () => {
      const expected = invalidFixtures().find((f) => f.name === 'heavy-model-failsafe')!;
      const result = await run('check', [expected.file]);
      expect(result.code).toBe(1);
      const lines = result.stdout.trim().split('\n');
      expect(lines[0]).toMatch(new RegExp(`^${expected.line}:\\d+  warning  failsafe-unset  Pin 3 `));
      expect(lines[1]).toMatch(
        new RegExp(`^${expected.line}:\\d+  error  heavy-model-failsafe  The model weighs 7800 g`),
      );
      expect(lines[2]).toMatch(/heavy-model-failsafe\.yaml: 1 error, 1 warning, 0 infos$/);
    },
    TIMEOUT,
  );

  it(
    'exits 2 for a missing file, a folder and bad arguments, with --json still one object',
    async () => {
      const [missing, folder, none, unknownFlag, human] = await Promise.all([
        run('check', [fixture('valid/no-such-file.yaml'), '--json']),
        run('check', [FIXTURES_DIR, '--json']),
        run('check', ['--json']),
        run('check', [fixture('valid/every-field.yaml'), '--json', '--colour']),
        run('check', [fixture('valid/no-such-file.yaml')]),
      ]);
      for (const result of [missing, folder, none, unknownFlag]) {
        expect(result.code).toBe(2);
        expect(JSON.parse(result.stdout).error.message.length).toBeGreaterThan(0);
      }
      expect(JSON.parse(missing.stdout).error.message).toContain('no such file');
      expect(JSON.parse(folder.stdout).error.message).toContain('not a file');
      expect(human).toMatchObject({ code: 2, stdout: '' });
      expect(human.stderr).toContain('no such file');
    },
    TIMEOUT,
  );
});

describe('outputs', () => {
  it(
    'evaluates with --set and prints the bench view as JSON',
    async () => {
      const result = await run('outputs', [
        fixture('valid/trainer-single-receiver.yaml'),
        '--set',
        'aileron-stick=50',
        '--set',
        'rate-switch=1',
        '--set',
        'throttle-stick=100',
        '--json',
      ]);
      expect(result.code).toBe(0);
      const out = JSON.parse(result.stdout);
      // [expo-cubic] 70 % rate of curve(0.5) at 30 % expo: 27.125 % -> 1636 µs
      expect(out.channels[0]).toEqual({ ch: 1, function: 'aileron', value: 27.13, pulse_us: 1636 });
      // The motor stays cut: motor-arm is at position 0.
      expect(out.channels[2]).toEqual({ ch: 3, function: 'motor', value: -100, pulse_us: 1000 });
      expect(out.receivers[0].pins[2]).toEqual({ pin: 3, ch: 3, pulse_us: 1000, failsafe: 1000 });
    },
    TIMEOUT,
  );

  it(
    'exits 2 for a control that does not exist or a position the switch does not have, 1 for a setup with errors',
    async () => {
      const [unknown, position, broken, human] = await Promise.all([
        run('outputs', [fixture('valid/trainer-single-receiver.yaml'), '--set', 'wheel=3', '--json']),
        run('outputs', [fixture('valid/trainer-single-receiver.yaml'), '--set', 'rate-switch=2', '--json']),
        run('outputs', [fixture('invalid/schema.yaml'), '--json']),
        run('outputs', [fixture('valid/scale-16-channel-two-receivers.yaml')]),
      ]);
      expect(unknown.code).toBe(2);
      expect(JSON.parse(unknown.stdout).error.message).toContain('no control wheel');
      expect(position.code).toBe(2);
      expect(broken.code).toBe(1);
      expect(JSON.parse(broken.stdout).findings[0].rule).toBe('schema');
      expect(human.code).toBe(0);
      expect(human.stdout).toContain('Receiver wing');
    },
    TIMEOUT,
  );

  it(
    '--lost loses one receiver (or all): the FORMAT shape, lost receivers send their failsafes, the others stay live',
    async () => {
      const demo = fixture('valid/scale-16-channel-two-receivers.yaml');
      const [one, all, unknown] = await Promise.all([
        run('outputs', [demo, '--set', 'cowl-knob=50', '--lost', 'wing', '--json']),
        run('outputs', [demo, '--set', 'cowl-knob=50', '--lost', 'all', '--json']),
        run('outputs', [demo, '--lost', 'nowhere', '--json']),
      ]);
      expect(one.code).toBe(0);
      const out = JSON.parse(one.stdout);
      // docs/format.md, "Command line": channels as before; each receiver adds `lost`.
      expect(Object.keys(out)).toEqual(['channels', 'receivers']);
      for (const channel of out.channels) expect(Object.keys(channel)).toEqual(['ch', 'function', 'value', 'pulse_us']);
      expect(out.receivers.map((receiver: { id: string; lost: boolean }) => [receiver.id, receiver.lost])).toEqual([
        ['fuselage', false],
        ['wing', true],
      ]);
      for (const receiver of out.receivers) {
        expect(Object.keys(receiver)).toEqual(['id', 'lost', 'pins']);
        for (const pin of receiver.pins) expect(Object.keys(pin)).toEqual(['pin', 'ch', 'pulse_us', 'failsafe']);
      }
      // The cowl knob at 50 % puts channel 15 at 1750 us; the wing's pin 7 carries it
      // and, lost, sends its 1500 us failsafe instead.
      expect(out.channels.find((channel: { ch: number }) => channel.ch === 15)).toMatchObject({ pulse_us: 1750 });
      expect(out.receivers[1].pins[6]).toEqual({ pin: 7, ch: 15, pulse_us: 1500, failsafe: 1500 });
      // hold repeats the last live pulse.
      expect(out.receivers[1].pins[1]).toEqual({ pin: 2, ch: 10, pulse_us: 1500, failsafe: 'hold' });
      // The fuselage keeps the link: its pins follow the sticks, not the failsafes.
      expect(out.receivers[0].pins[6]).toEqual({ pin: 7, ch: 7, pulse_us: 1000, failsafe: 1500 });

      expect(all.code).toBe(0);
      const everything = JSON.parse(all.stdout);
      expect(everything.receivers.map((receiver: { lost: boolean }) => receiver.lost)).toEqual([true, true]);
      expect(everything.receivers[0].pins[6]).toEqual({ pin: 7, ch: 7, pulse_us: 1500, failsafe: 1500 });

      expect(unknown.code).toBe(2);
      expect(JSON.parse(unknown.stdout).error.message).toContain('no receiver nowhere');
    },
    TIMEOUT,
  );
});
