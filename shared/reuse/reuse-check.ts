import type { Finding } from '../findings';
import type { Receiver, Setup } from '../format/schema';
import { describeFailsafe, type StoredFailsafe, type StoredPin, type StoredSettings } from './stored-settings';

// The reuse check: what must change on a physical unit before it flies in a receiver
// slot of a setup. The unit keeps whatever its last airframe needed (pin map, per-pin
// failsafes, telemetry); the slot says what this airframe needs. Every difference the
// pilot has to program is a change; anything that cannot be fixed by programming (too
// few outputs) blocks; anything harmless but worth knowing is a note.
//
// Decisions where the format is silent:
// - A slot pin without a failsafe means "receiver default". A unit that still holds a
//   value for that pin from its last airframe must have it cleared (to: null), since a
//   left-over value is exactly the hazard this check exists for; when the unit holds
//   none either, nothing changes and the slot's `failsafe-unset` finding speaks.
// - Pins the unit drives that the slot does not use are notes, not changes: nothing
//   plugged into them moves. They keep their stored mapping.
// - `ready` speaks of the unit only: a setup with check errors still gets a ready unit;
//   its findings for the slot come along for the pilot to read.

export type ReuseSetting = 'ch' | 'failsafe' | 'telemetry';

export interface ReuseChange {
  /** The output pin, null for telemetry (a setting of the whole unit). */
  pin: number | null;
  setting: ReuseSetting;
  from: number | StoredFailsafe | boolean | null;
  to: number | StoredFailsafe | boolean | null;
  /** A plain sentence: "Pin 3: carries channel 3, must carry channel 11". */
  summary: string;
  /**
   * Why this change is a safety matter, when it is one: the throttle's failsafe or its
   * channel (a motor that runs on after signal loss), an old failsafe held at an end of
   * travel (an old throttle's, wherever it now points) and telemetry (two receivers
   * answering at once, or none). The check lists these first. Null for the rest.
   */
  safety: string | null;
}

export type ReuseNoteKind = 'outputs-short' | 'outputs-differ' | 'pin-unused' | 'settings-unknown';

export interface ReuseNote {
  kind: ReuseNoteKind;
  pin: number | null;
  /** True when programming cannot fix it: the unit cannot fly in this slot as the setup stands. */
  blocking: boolean;
  message: string;
}

/** The physical unit as the shelf knows it. */
export interface ReuseUnit {
  outputs: number;
  /** Null when the unit's settings were never recorded. */
  stored: StoredSettings | null;
}

export interface ReuseSlot {
  id: string;
  label: string | null;
  role: Receiver['role'];
  outputs: number;
  telemetry: boolean;
}

export interface ReuseCheck {
  slot: ReuseSlot;
  changes: ReuseChange[];
  notes: ReuseNote[];
  /** True only when nothing must change and nothing blocks. */
  ready: boolean;
  /** The model's findings whose path is within this slot (`receivers[id=<slot>]...`). */
  findings: Finding[];
  /** What the unit holds once every change is made: what "I have applied these settings" records. */
  target: StoredSettings;
}

/** The receiver of the setup with this id, the first one when ids repeat (duplicate-id reports that). */
export function findSlot(setup: Setup, slotId: string): Receiver | undefined {
  return setup.receivers.find((receiver) => receiver.id === slotId);
}

/** The findings whose semantic path is the slot itself or something inside it. */
export function findingsForSlot(findings: readonly Finding[], slotId: string): Finding[] {
  const root = `receivers[id=${slotId}]`;
  return findings.filter(
    (finding) => finding.path === root || finding.path.startsWith(`${root}.`) || finding.path.startsWith(`${root}[`),
  );
}

// A held pulse this near an end of travel is what an old throttle failsafe looks like
// (motor off at the low end, full power at the high end); wherever the unit goes next,
// that output is driven to its end on signal loss. The bounds are common practice, no
// published source: the usual 1000-2000 µs travel with 100 µs taken from each end.
const END_OF_TRAVEL_LOW_US = 1100;
const END_OF_TRAVEL_HIGH_US = 1900;
const isEndOfTravel = (failsafe: ReuseChange['from']): failsafe is number =>
  typeof failsafe === 'number' && (failsafe <= END_OF_TRAVEL_LOW_US || failsafe >= END_OF_TRAVEL_HIGH_US);

const sameFailsafe = (a: StoredFailsafe | undefined, b: StoredFailsafe | undefined): boolean =>
  (a ?? null) === (b ?? null);
const onOff = (value: boolean) => (value ? 'on' : 'off');

function pinList(pins: readonly number[]): string {
  if (pins.length === 1) return `pin ${pins[0]}`;
  const contiguous = pins.every((pin, i) => i === 0 || pin === pins[i - 1] + 1);
  return contiguous
    ? `pins ${pins[0]}-${pins[pins.length - 1]}`
    : `pins ${pins.slice(0, -1).join(', ')} and ${pins[pins.length - 1]}`;
}

function channelChange(pin: number, from: StoredPin | undefined, known: boolean, ch: number): ReuseChange | null {
  if (from?.ch === ch) return null;
  const now = !known ? 'channel not recorded' : from ? `carries channel ${from.ch}` : 'carries no channel';
  return {
    pin,
    setting: 'ch',
    from: from?.ch ?? null,
    to: ch,
    summary: `Pin ${pin}: ${now}, must carry channel ${ch}`,
    safety: null,
  };
}

function failsafeChange(
  pin: number,
  from: StoredPin | undefined,
  known: boolean,
  wanted: StoredFailsafe,
): ReuseChange | null {
  const held = from?.failsafe ?? null;
  if (known && sameFailsafe(held, wanted)) return null;
  // Unknown settings and a slot that wants the receiver default: nothing to program.
  if (!known && wanted === null) return null;
  const now = !known ? 'failsafe not recorded' : held === null ? 'no failsafe' : `failsafe ${describeFailsafe(held)}`;
  const action =
    wanted === null
      ? 'clear it to the receiver default (the setup sets none)'
      : wanted === 'off'
        ? 'set off (no pulses)'
        : `set ${describeFailsafe(wanted)}`;
  return {
    pin,
    setting: 'failsafe',
    from: known ? held : null,
    to: wanted,
    summary: `Pin ${pin}: ${now}, ${action}`,
    safety: null,
  };
}

/**
 * Compares a unit's stored settings with a slot of a setup. `findings` are the setup's
 * findings (all of them; those of the slot are picked out).
 */
export function reuseCheck(
  unit: ReuseUnit,
  slot: Receiver,
  findings: readonly Finding[] = [],
  setup?: Pick<Setup, 'channels'>,
): ReuseCheck {
  const throttles = new Set(
    (setup?.channels ?? []).filter((channel) => channel.role === 'throttle').map((channel) => channel.ch),
  );
  const known = unit.stored !== null;
  const stored = new Map((unit.stored?.pins ?? []).map((entry) => [entry.pin, entry]));
  const changes: ReuseChange[] = [];
  const notes: ReuseNote[] = [];
  const targetPins = new Map<number, StoredPin>();

  if (!known) {
    notes.push({
      kind: 'settings-unknown',
      pin: null,
      blocking: false,
      message: 'This unit’s settings were never recorded, so every setting of the slot is listed: program each one.',
    });
  }

  const slotPins = new Map<number, Receiver['map'][number]>();
  for (const entry of slot.map) if (!slotPins.has(entry.pin)) slotPins.set(entry.pin, entry);
  const wantedPins = [...slotPins.values()].sort((a, b) => a.pin - b.pin);

  const beyond = wantedPins.filter((entry) => entry.pin > unit.outputs);
  if (beyond.length > 0) {
    const channels = beyond.map((entry) => entry.ch).join(', ');
    notes.push({
      kind: 'outputs-short',
      pin: null,
      blocking: true,
      message: `The slot needs ${pinList(beyond.map((entry) => entry.pin))} but this unit has only ${unit.outputs} outputs, so it cannot carry channel${beyond.length === 1 ? '' : 's'} ${channels}. Use a unit with at least ${beyond[beyond.length - 1].pin} outputs or change the setup.`,
    });
  } else if (slot.outputs !== unit.outputs) {
    notes.push({
      kind: 'outputs-differ',
      pin: null,
      blocking: false,
      message: `The setup says this slot's receiver has ${slot.outputs} outputs; this unit has ${unit.outputs}. Every pin the slot uses fits; set outputs: ${unit.outputs} in the setup so the record matches the unit.`,
    });
  }

  for (const entry of wantedPins) {
    if (entry.pin > unit.outputs) continue;
    const held = stored.get(entry.pin);
    const wanted: StoredFailsafe = entry.failsafe ?? null;
    const ch = channelChange(entry.pin, held, known, entry.ch);
    const failsafe = failsafeChange(entry.pin, held, known, wanted);
    if (ch) changes.push(ch);
    if (failsafe) changes.push(failsafe);
    targetPins.set(entry.pin, { pin: entry.pin, ch: entry.ch, failsafe: wanted });
  }

  for (const held of stored.values()) {
    if (slotPins.has(held.pin)) continue;
    notes.push({
      kind: 'pin-unused',
      pin: held.pin,
      blocking: false,
      message: `Pin ${held.pin}: carries channel ${held.ch}, which this slot does not use; leave it unplugged.`,
    });
    if (held.pin <= unit.outputs) targetPins.set(held.pin, held);
  }

  const telemetryNow = unit.stored?.telemetry ?? null;
  if (telemetryNow !== slot.telemetry) {
    const now = telemetryNow === null ? 'not recorded' : onOff(telemetryNow);
    changes.push({
      pin: null,
      setting: 'telemetry',
      from: telemetryNow,
      to: slot.telemetry,
      summary: `Telemetry: ${now}, switch it ${onOff(slot.telemetry)}`,
      safety: slot.telemetry
        ? 'Without telemetry from this unit the model reports nothing back (battery, signal).'
        : 'Two receivers sending telemetry answer the transmitter at once and can disturb the link.',
    });
  }

  // Safety first, common practice, no published source: what can make a motor run on or
  // disturb the link is programmed and checked before the rest.
  for (const change of changes) {
    if (change.pin === null || change.safety !== null) continue;
    const wanted = slotPins.get(change.pin);
    if (wanted && throttles.has(wanted.ch)) {
      change.safety =
        change.setting === 'failsafe'
          ? 'This pin drives the throttle: a wrong failsafe can keep the motor running after signal loss.'
          : 'This pin is to drive the throttle: until it does, the motor may answer another channel.';
    } else if (change.setting === 'failsafe' && isEndOfTravel(change.from)) {
      change.safety = `A failsafe left from the last airframe (${describeFailsafe(change.from)}) drives this output to its end on signal loss: whatever is plugged in here goes to full travel.`;
    }
  }
  changes.sort((a, b) => Number(b.safety !== null) - Number(a.safety !== null));

  notes.sort((a, b) => Number(b.blocking) - Number(a.blocking) || (a.pin ?? 0) - (b.pin ?? 0));
  return {
    slot: { id: slot.id, label: slot.label ?? null, role: slot.role, outputs: slot.outputs, telemetry: slot.telemetry },
    changes,
    notes,
    ready: changes.length === 0 && !notes.some((note) => note.blocking),
    findings: findingsForSlot(findings, slot.id),
    target: { telemetry: slot.telemetry, pins: [...targetPins.values()].sort((a, b) => a.pin - b.pin) },
  };
}
