import { evaluate, type PinOutput } from '../evaluate/evaluate';
import type { Setup } from '../format/schema';
import { LIST_KEYS, matchList } from './identity';
import { toBare } from './plain';

/** A named set of control positions; `set` holds only the controls moved from rest. */
export interface PositionSet {
  label: string;
  set: Record<string, number>;
}

type Failsafe = PinOutput['failsafe'];

/**
 * One receiver pin that behaves differently in the new revision.
 *
 * - kind `pulse`: at `position`, the pin's pulse. `before_us` / `after_us` are null
 *   where the pin does not exist on that side (a receiver or map entry added or
 *   removed).
 * - kind `failsafe`: what the pin does on signal loss (a pulse, "hold", "off", or null
 *   for the receiver's default); `position` is the pseudo-position "signal lost".
 *   Only pins present on both sides, since a pin that appears or disappears already
 *   shows in its pulse rows.
 *
 * `ch_before` / `ch_after` say which channel the pin carries on each side, so a view
 * can tell a remap from a changed mix.
 */
export interface OutputDelta {
  kind: 'pulse' | 'failsafe';
  position: PositionSet;
  receiver: string;
  pin: number;
  ch_before: number | null;
  ch_after: number | null;
  before_us: number | Failsafe;
  after_us: number | Failsafe;
  summary: string;
}

export const REST: PositionSet = { label: 'at rest (axes centred, switches at position 0)', set: {} };
export const SIGNAL_LOST: PositionSet = { label: 'on signal loss', set: {} };

function signed(value: number): string {
  return value > 0 ? `+${value}` : String(value);
}

// The standard positions: everything at rest; each axis, knob or slider at -100 and
// +100 with the others at rest; each switch in each position other than 0 (position 0
// is rest already) with the others at rest. Controls of both revisions take part, so a
// control that exists on one side only is still exercised; evaluate ignores positions
// of controls a setup does not have and keeps a switch within its own positions.
// `set` names the new revision's controls; a control renamed between the revisions
// (matched as the diff matches them) is exercised once, under its new name, and
// `renamedControls` maps that name back for the old revision.
export function standardPositions(before: Setup, after: Setup): PositionSet[] {
  const sets: PositionSet[] = [REST];
  const seen = new Set<string>([REST.label]);
  const add = (set: PositionSet) => {
    if (seen.has(set.label)) return;
    seen.add(set.label);
    sets.push(set);
  };
  const renamedFrom = new Set(renamedControls(before, after).values());
  const controls = [...after.controls, ...before.controls.filter((control) => !renamedFrom.has(control.id))];
  for (const control of controls) {
    if (control.kind === 'switch') {
      for (let position = 1; position < control.positions; position++) {
        add({ label: `${control.id} at position ${position}`, set: { [control.id]: position } });
      }
    } else {
      for (const value of [-100, 100])
        add({ label: `${control.id} at ${signed(value)} %`, set: { [control.id]: value } });
    }
  }
  return sets;
}

/** New control id -> old id, for controls renamed with nothing else changed. */
export function renamedControls(before: Setup, after: Setup): Map<string, string> {
  const left = toBare(before.controls) as unknown[];
  const right = toBare(after.controls) as unknown[];
  const match = matchList(left, right, LIST_KEYS.controls, new WeakMap(), 'controls');
  const renamed = new Map<string, string>();
  for (const j of match.renamed) {
    const i = match.rightToLeft.get(j);
    if (i !== undefined) renamed.set(after.controls[j].id, before.controls[i].id);
  }
  return renamed;
}

function translate(set: Record<string, number>, names: Map<string, string>): Record<string, number> {
  const result: Record<string, number> = {};
  for (const [id, value] of Object.entries(set)) result[names.get(id) ?? id] = value;
  return result;
}

interface PinState {
  ch: number;
  pulse: number;
  failsafe: Failsafe;
}

function pinStates(setup: Setup, set: Record<string, number>): Map<string, PinState> {
  const states = new Map<string, PinState>();
  for (const receiver of evaluate(setup, set).receivers) {
    for (const pin of receiver.pins) {
      const id = pinKey(receiver.id, pin.pin);
      // A duplicate pin (reported by duplicate-id) keeps its first entry.
      if (!states.has(id)) states.set(id, { ch: pin.ch, pulse: pin.pulse_us, failsafe: pin.failsafe });
    }
  }
  return states;
}

function pinKey(receiver: string, pin: number): string {
  return `${receiver}\u0000${pin}`;
}

function pinOrder(before: Setup, after: Setup): { receiver: string; pin: number; key: string }[] {
  const order: { receiver: string; pin: number; key: string }[] = [];
  const seen = new Set<string>();
  for (const setup of [after, before]) {
    for (const receiver of setup.receivers) {
      for (const entry of [...receiver.map].sort((a, b) => a.pin - b.pin)) {
        const key = pinKey(receiver.id, entry.pin);
        if (seen.has(key)) continue;
        seen.add(key);
        order.push({ receiver: receiver.id, pin: entry.pin, key });
      }
    }
  }
  return order;
}

function receiverNames(before: Setup, after: Setup): Map<string, string> {
  const names = new Map<string, string>();
  for (const setup of [before, after]) {
    for (const receiver of setup.receivers) {
      names.set(
        receiver.id,
        receiver.label && receiver.label.trim() !== '' ? receiver.label : `Receiver ${receiver.id}`,
      );
    }
  }
  return names;
}

function pulseText(value: number | null): string {
  return value === null ? 'no output' : `${value} us`;
}

function failsafeText(value: Failsafe): string {
  if (value === null) return 'receiver default';
  if (value === 'hold') return 'hold last pulse';
  if (value === 'off') return 'stop pulses';
  return `${value} us`;
}

/**
 * Which receiver pins output a different pulse in `after` than in `before` at the
 * standard positions, and which fail safe differently. Both setups must be
 * schema-valid (Setup, defaults applied).
 */
export function outputsDelta(before: Setup, after: Setup): OutputDelta[] {
  const names = receiverNames(before, after);
  const pins = pinOrder(before, after);
  const oldNames = renamedControls(before, after);
  const deltas: OutputDelta[] = [];
  const restLeft = pinStates(before, {});
  const restRight = pinStates(after, {});
  for (const position of standardPositions(before, after)) {
    const atRest = position === REST;
    const left = atRest ? restLeft : pinStates(before, translate(position.set, oldNames));
    const right = atRest ? restRight : pinStates(after, position.set);
    for (const { receiver, pin, key } of pins) {
      const a = left.get(key);
      const b = right.get(key);
      const beforeUs = a ? a.pulse : null;
      const afterUs = b ? b.pulse : null;
      if (beforeUs === afterUs) continue;
      // A pin on one side only is listed at rest and wherever it moves from there, not
      // at every position with the same pulse.
      if (!atRest && (a === undefined || b === undefined)) {
        const rest = (a ? restLeft : restRight).get(key);
        if (rest && rest.pulse === (a ?? b)?.pulse) continue;
      }
      deltas.push({
        kind: 'pulse',
        position,
        receiver,
        pin,
        ch_before: a?.ch ?? null,
        ch_after: b?.ch ?? null,
        before_us: beforeUs,
        after_us: afterUs,
        summary: `${names.get(receiver)} pin ${pin}, ${position.label}: ${pulseText(beforeUs)} -> ${pulseText(afterUs)}`,
      });
    }
  }
  for (const { receiver, pin, key } of pins) {
    const a = restLeft.get(key);
    const b = restRight.get(key);
    if (!a || !b || a.failsafe === b.failsafe) continue;
    deltas.push({
      kind: 'failsafe',
      position: SIGNAL_LOST,
      receiver,
      pin,
      ch_before: a.ch,
      ch_after: b.ch,
      before_us: a.failsafe,
      after_us: b.failsafe,
      summary: `${names.get(receiver)} pin ${pin}, ${SIGNAL_LOST.label}: ${failsafeText(a.failsafe)} -> ${failsafeText(b.failsafe)}`,
    });
  }
  return deltas;
}
