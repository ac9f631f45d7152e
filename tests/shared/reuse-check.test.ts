import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { parse } from 'yaml';
import { describe, expect, it } from 'vitest';
import { analyzeSetup, type Analysis } from '@shared/analyze';
import type { Setup } from '@shared/format/schema';
import { findSlot, findingsForSlot, reuseCheck, type ReuseUnit } from '@shared/reuse/reuse-check';
import { storedSettingsSchema } from '@shared/reuse/stored-settings';

const fixture = (path: string) =>
  readFileSync(fileURLToPath(new URL(`../../fixtures/${path}`, import.meta.url)), 'utf8');

function loadSetup(name: string): Analysis & { setup: Setup } {
  const analysis = analyzeSetup(fixture(`valid/${name}.yaml`));
  if (!analysis.setup) throw new Error(`fixture ${name} is not schema-valid`);
  return analysis as Analysis & { setup: Setup };
}

function loadUnit(name: string): ReuseUnit {
  const raw = parse(fixture(`reuse/${name}.yaml`)) as { outputs: number; stored_settings: unknown };
  return { outputs: raw.outputs, stored: storedSettingsSchema.parse(raw.stored_settings) };
}

const sixteen = loadSetup('scale-16-channel-two-receivers');
const trainer = loadSetup('trainer-single-receiver');
const slot = (analysis: { setup: Setup }, id: string) => {
  const found = findSlot(analysis.setup, id);
  if (!found) throw new Error(`no slot ${id}`);
  return found;
};

describe('a unit from a single-receiver model moved into the secondary slot of a 16-channel model', () => {
  const check = reuseCheck(loadUnit('trainer-unit'), slot(sixteen, 'wing'), sixteen.findings);

  it('remaps pins 1-8 from channels 1-8 to 9-16', () => {
    const remaps = check.changes.filter((change) => change.setting === 'ch');
    expect(remaps.map(({ pin, from, to }) => [pin, from, to])).toEqual(
      [1, 2, 3, 4, 5, 6, 7, 8].map((pin) => [pin, pin, pin + 8]),
    );
    expect(remaps[2].summary).toBe('Pin 3: carries channel 3, must carry channel 11');
  });

  it('resets the old throttle pin’s failsafe and every other failsafe the wing slot sets differently', () => {
    const failsafes = check.changes.filter((change) => change.setting === 'failsafe');
    // Worked by hand from the two files: the wing holds pins 2-6 and fails safe pins 1, 7, 8 to 1500 µs.
    // The old throttle's 988 µs leads: it is a safety change (below).
    expect(failsafes.map(({ pin, from, to }) => [pin, from, to])).toEqual([
      [3, 988, 'hold'],
      [2, 1500, 'hold'],
      [4, 1500, 'hold'],
      [6, 1500, 'hold'],
    ]);
    expect(failsafes.find((change) => change.pin === 3)?.summary).toBe('Pin 3: failsafe 988 µs, set hold');
  });

  it('switches telemetry off, as a setting of the whole unit', () => {
    const telemetry = check.changes.filter((change) => change.setting === 'telemetry');
    expect(telemetry).toEqual([
      {
        pin: null,
        setting: 'telemetry',
        from: true,
        to: false,
        summary: 'Telemetry: on, switch it off',
        safety: 'Two receivers sending telemetry answer the transmitter at once and can disturb the link.',
      },
    ]);
  });

  it('singles out the old throttle failsafe (988 µs) though the wing slot’s pin 3 drives no throttle', () => {
    const old = check.changes.find((change) => change.pin === 3 && change.setting === 'failsafe');
    expect(old?.safety).toBe(
      'A failsafe left from the last airframe (988 µs) drives this output to its end on signal loss: whatever is plugged in here goes to full travel.',
    );
    const centred = check.changes.filter((change) => change.setting === 'failsafe' && change.from === 1500);
    expect(centred.map((change) => change.safety)).toEqual([null, null, null]);
  });

  it('is not ready, lists the safety changes (that failsafe, telemetry) first, then pin by pin, and targets the slot’s settings', () => {
    expect(check.ready).toBe(false);
    expect(check.notes).toEqual([]);
    expect(check.changes.map((change) => [change.pin, change.setting])).toEqual([
      [3, 'failsafe'],
      [null, 'telemetry'],
      ...[1, 2, 2, 3, 4, 4, 5, 6, 6, 7, 8].map((pin, i, pins) => [pin, pins[i - 1] === pin ? 'failsafe' : 'ch']),
    ]);
    expect(check.target).toEqual({
      telemetry: false,
      pins: slot(sixteen, 'wing').map.map(({ pin, ch, failsafe }) => ({ pin, ch, failsafe })),
    });
    expect(check.slot).toEqual({
      id: 'wing',
      label: 'Wing receiver (red tape)',
      role: 'secondary',
      outputs: 8,
      telemetry: false,
    });
  });
});

describe('a unit already programmed for its slot', () => {
  it('is ready with no changes and no notes', () => {
    const check = reuseCheck(loadUnit('wing-unit'), slot(sixteen, 'wing'), sixteen.findings);
    expect(check).toMatchObject({ changes: [], notes: [], ready: true });
  });

  it('is ready in the trainer it came from, too', () => {
    const check = reuseCheck(loadUnit('six-output-unit'), slot(trainer, 'cabin'), trainer.findings);
    expect(check).toMatchObject({ changes: [], notes: [], ready: true });
  });

  it('stays ready whatever the setup’s own findings are: they are reported, not counted as changes', () => {
    const check = reuseCheck(loadUnit('wing-unit'), slot(sixteen, 'wing'), [
      {
        rule: 'failsafe-unset',
        severity: 'warning',
        message: 'm',
        hint: 'h',
        path: 'receivers[id=wing].map[pin=3].failsafe',
        line: 1,
        column: 1,
      },
    ]);
    expect(check.ready).toBe(true);
    expect(check.findings.map((finding) => finding.rule)).toEqual(['failsafe-unset']);
  });
});

describe('output counts', () => {
  it('reports a slot that needs more pins than the unit has, and that blocks', () => {
    const check = reuseCheck(loadUnit('six-output-unit'), slot(sixteen, 'wing'));
    expect(check.ready).toBe(false);
    expect(check.notes).toHaveLength(1);
    expect(check.notes[0]).toMatchObject({ kind: 'outputs-short', blocking: true });
    expect(check.notes[0].message).toContain('needs pins 7-8 but this unit has only 6 outputs');
    expect(check.notes[0].message).toContain('channels 15, 16');
    // Pins the unit cannot carry are not offered as changes to program.
    expect(check.changes.some((change) => (change.pin ?? 0) > 6)).toBe(false);
    expect(check.target.pins.map((entry) => entry.pin)).toEqual([1, 2, 3, 4, 5, 6]);
  });

  it('notes, without blocking, a declared output count that differs when every used pin fits', () => {
    const unit = { ...loadUnit('wing-unit'), outputs: 10 };
    const check = reuseCheck(unit, slot(sixteen, 'wing'));
    expect(check.ready).toBe(true);
    expect(check.notes).toEqual([expect.objectContaining({ kind: 'outputs-differ', blocking: false })]);
  });
});

describe('pins and failsafes the slot leaves alone', () => {
  it('notes pins the unit drives that the slot does not use, and keeps them in the target', () => {
    const unit = loadUnit('six-output-unit');
    const withSpare: ReuseUnit = {
      ...unit,
      stored: { ...unit.stored!, pins: [...unit.stored!.pins, { pin: 5, ch: 5, failsafe: 1500 }] },
    };
    const check = reuseCheck(withSpare, slot(trainer, 'cabin'));
    expect(check.ready).toBe(true);
    expect(check.notes).toEqual([
      {
        kind: 'pin-unused',
        pin: 5,
        blocking: false,
        message: 'Pin 5: carries channel 5, which this slot does not use; leave it unplugged.',
      },
    ]);
    expect(check.target.pins.find((entry) => entry.pin === 5)).toEqual({ pin: 5, ch: 5, failsafe: 1500 });
  });

  it('asks to clear a left-over failsafe where the slot sets none, and asks nothing where neither does', () => {
    const cabin = slot(trainer, 'cabin');
    const unset = {
      ...cabin,
      map: cabin.map.map((entry) => (entry.pin === 3 || entry.pin === 4 ? { pin: entry.pin, ch: entry.ch } : entry)),
    };
    const unit = loadUnit('six-output-unit');
    const stored = {
      ...unit.stored!,
      pins: unit.stored!.pins.map((entry) => (entry.pin === 4 ? { ...entry, failsafe: null } : entry)),
    };
    const check = reuseCheck({ ...unit, stored }, unset);
    expect(check.changes).toEqual([
      {
        pin: 3,
        setting: 'failsafe',
        from: 1000,
        to: null,
        summary: 'Pin 3: failsafe 1000 µs, clear it to the receiver default (the setup sets none)',
        safety: expect.stringMatching(
          /^A failsafe left from the last airframe \(1000 µs\) drives this output to its end/,
        ),
      },
    ]);
  });

  it('counts a held pulse at either end of travel as a safety change, and nothing between or held by mode', () => {
    // The bounds are common practice, no published source: 1100 µs and below, 1900 µs and above.
    const cabin = slot(trainer, 'cabin');
    const unit = loadUnit('six-output-unit');
    const holding = (failsafe: number | 'hold' | 'off') => ({
      ...unit,
      stored: {
        ...unit.stored!,
        pins: unit.stored!.pins.map((entry) => (entry.pin === 1 ? { ...entry, failsafe } : entry)),
      },
    });
    const pin1 = (failsafe: number | 'hold' | 'off') => {
      const changes = reuseCheck(holding(failsafe), cabin).changes;
      expect(changes.map((change) => change.pin)).toEqual([1]);
      return changes[0].safety !== null;
    };
    const held: (number | 'hold' | 'off')[] = [988, 1100, 1101, 1899, 1900, 2012, 'hold', 'off'];
    expect(held.map(pin1)).toEqual([true, true, false, false, true, true, false, false]);
  });

  it('names a pin the unit leaves without a failsafe', () => {
    const unit = loadUnit('six-output-unit');
    const stored = {
      ...unit.stored!,
      pins: unit.stored!.pins.map((entry) => (entry.pin === 4 ? { ...entry, failsafe: null } : entry)),
    };
    expect(reuseCheck({ ...unit, stored }, slot(trainer, 'cabin')).changes).toEqual([
      { pin: 4, setting: 'failsafe', from: null, to: 1500, summary: 'Pin 4: no failsafe, set 1500 µs', safety: null },
    ]);
  });

  it('says "off (no pulses)" when the slot stops a pin on signal loss', () => {
    const cabin = slot(trainer, 'cabin');
    const off = {
      ...cabin,
      map: cabin.map.map((entry) => (entry.pin === 3 ? { ...entry, failsafe: 'off' as const } : entry)),
    };
    expect(reuseCheck(loadUnit('six-output-unit'), off).changes.map((change) => change.summary)).toEqual([
      'Pin 3: failsafe 1000 µs, set off (no pulses)',
    ]);
  });
});

describe('a unit whose settings were never recorded', () => {
  it('lists every setting of the slot as a change and notes why', () => {
    const check = reuseCheck({ outputs: 6, stored: null }, slot(trainer, 'cabin'));
    expect(check.ready).toBe(false);
    expect(check.notes.map((note) => note.kind)).toEqual(['settings-unknown']);
    expect(check.changes.map((change) => change.summary)).toEqual([
      'Telemetry: not recorded, switch it on',
      'Pin 1: channel not recorded, must carry channel 1',
      'Pin 1: failsafe not recorded, set 1500 µs',
      'Pin 2: channel not recorded, must carry channel 2',
      'Pin 2: failsafe not recorded, set 1500 µs',
      'Pin 3: channel not recorded, must carry channel 3',
      'Pin 3: failsafe not recorded, set 1000 µs',
      'Pin 4: channel not recorded, must carry channel 4',
      'Pin 4: failsafe not recorded, set 1500 µs',
    ]);
  });

  it('puts the throttle pin first when it is given the setup: a wrong throttle failsafe keeps a motor running', () => {
    const check = reuseCheck({ outputs: 6, stored: null }, slot(trainer, 'cabin'), [], trainer.setup);
    expect(check.changes.slice(0, 3).map((change) => change.summary)).toEqual([
      'Pin 3: channel not recorded, must carry channel 3',
      'Pin 3: failsafe not recorded, set 1000 µs',
      'Telemetry: not recorded, switch it on',
    ]);
    expect(check.changes[1].safety).toMatch(/motor running after signal loss/);
    expect(check.changes.slice(3).every((change) => change.safety === null)).toBe(true);
  });
});

describe('the slot’s findings', () => {
  const analysis = analyzeSetup(fixture('pairs/remap-second-receiver.after.yaml'));

  it('are exactly those whose path is within the slot', () => {
    const wing = findingsForSlot(analysis.findings, 'wing');
    expect(wing.length).toBeGreaterThan(0);
    expect(wing.every((finding) => finding.path.startsWith('receivers[id=wing]'))).toBe(true);
    expect(findingsForSlot(analysis.findings, 'win')).toEqual([]);
    const outside = analysis.findings.filter((finding) => !wing.includes(finding));
    expect(outside.some((finding) => finding.path.startsWith('receivers[id=wing]'))).toBe(false);
  });
});

describe('stored settings', () => {
  it('refuses a pin listed twice and a failsafe pulse out of range', () => {
    expect(
      storedSettingsSchema.safeParse({
        telemetry: true,
        pins: [
          { pin: 1, ch: 1 },
          { pin: 1, ch: 2 },
        ],
      }).success,
    ).toBe(false);
    // [arduino-servo]: 700-2300 µs is the range servos answer to.
    expect(storedSettingsSchema.safeParse({ telemetry: true, pins: [{ pin: 1, ch: 1, failsafe: 2400 }] }).success).toBe(
      false,
    );
    expect(
      storedSettingsSchema.parse({
        telemetry: false,
        pins: [
          { pin: 2, ch: 2 },
          { pin: 1, ch: 1, failsafe: 'hold' },
        ],
      }),
    ).toEqual({
      telemetry: false,
      pins: [
        { pin: 1, ch: 1, failsafe: 'hold' },
        { pin: 2, ch: 2, failsafe: null },
      ],
    });
  });
});
