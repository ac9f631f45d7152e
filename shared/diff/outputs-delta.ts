import { channelValue, pinPulse, pulseFor, type PinOutput } from '../evaluate/evaluate';
import { restPositions } from '../evaluate/rest';
import type { Setup } from '../format/schema';
import {
  axesOf,
  channelForm,
  pinKey,
  pinSources,
  sameForm,
  sameSource,
  switchesOf,
  type ChannelForm,
  type PinSource,
} from './channel-form';
import { LIST_KEYS, matchList } from './identity';
import { toBare } from './plain';
import { lineOf, witnesses } from './pulse-witness';

/**
 * A position of the controls and a state of the link: `set` gives the controls the
 * entry depends on (new-revision ids; axes in percent, switches by position), every
 * other control is at rest (evaluation rule 8); `lost` the receivers that have lost
 * the link, the others keep it.
 */
export interface PositionSet {
  label: string;
  set: Record<string, number>;
  lost: string[];
}

type Failsafe = PinOutput['failsafe'];

/**
 * One receiver pin that behaves differently in the new revision, at one position.
 *
 * - kind `pulse`: with the link up, the pin's pulse at `position`. `before_us` /
 *   `after_us` are null where the pin does not exist on that side.
 * - kind `failsafe`: with the pin's receiver lost (`position.lost`), what it sends at
 *   `position` (null for no pulses or the receiver's default); `failsafe_before` /
 *   `failsafe_after` say what each side is set to.
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
  before_us: number | null;
  after_us: number | null;
  failsafe_before?: Failsafe;
  failsafe_after?: Failsafe;
  summary: string;
}

export const REST_LABEL = 'at rest (throttle at its stop, other axes centred, switches at position 0)';

/** Beyond this many switch combinations for one pin, each switch is moved on its own from rest. */
const COMBINATION_LIMIT = 59049;
/** How many candidate points are checked against the full bench evaluation per line. */
const VERIFY_LIMIT = 64;

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

// A copy of `base` with `more` on top, to be extended further. Not `{ ...a, ...b }`
// or `{ ...a }` plus assignments: on Node 20 a property added to a spread copy costs
// microseconds (some thirty times what this costs, for the stress setup's positions),
// and the outputs search makes hundreds of positions per changed pin. Keys are control
// ids (slugs), so assigning them cannot meet `__proto__`.
function extended(
  base: Readonly<Record<string, number>>,
  more: Readonly<Record<string, number>> = {},
): Record<string, number> {
  return Object.assign({}, base, more);
}

function translate(set: Readonly<Record<string, number>>, names: Map<string, string>): Record<string, number> {
  const result: Record<string, number> = {};
  for (const [id, value] of Object.entries(set)) result[names.get(id) ?? id] = value;
  return result;
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

function pulseText(value: number | null, lost: boolean): string {
  if (value !== null) return `${value} µs`;
  return lost ? 'no pulses' : 'no output';
}

function percent(value: number): string {
  const rounded = Math.round(value * 100) / 100;
  return `${rounded > 0 ? '+' : ''}${rounded} %`;
}

/** Every switch combination of `switches` (name -> positions), position 0 first. */
function* combinations(switches: Map<string, number>): Generator<Record<string, number>> {
  const names = [...switches.keys()];
  const sizes = names.map((name) => switches.get(name)!);
  let total = 1;
  for (const size of sizes) total *= size;
  if (total > COMBINATION_LIMIT) {
    yield {};
    for (const [i, name] of names.entries()) for (let p = 1; p < sizes[i]; p += 1) yield { [name]: p };
    return;
  }
  const position = new Array<number>(names.length).fill(0);
  for (let n = 0; n < total; n += 1) {
    const state: Record<string, number> = {};
    for (let i = 0; i < names.length; i += 1) state[names[i]] = position[i];
    yield state;
    for (let i = 0; i < names.length; i += 1) {
      position[i] += 1;
      if (position[i] < sizes[i]) break;
      position[i] = 0;
    }
  }
}

interface Context {
  before: Setup;
  after: Setup;
  oldNames: Map<string, string>;
  rest: Record<string, number>;
  kinds: Map<string, string>;
  names: Map<string, string>;
  /** The new-revision name of an old revision's control. */
  globalOld: (id: string) => string;
  leftPins: Map<string, PinSource>;
  rightPins: Map<string, PinSource>;
}

/**
 * The bench pulse of one pin at a position (new-revision names) and link state,
 * computed as evaluate() does (the same channelValue and pulseFor), from the pin's
 * channel only, so that a reported position is exactly what the bench shows.
 */
function benchPulse(
  ctx: Context,
  side: 'before' | 'after',
  receiver: string,
  pin: number,
  set: Record<string, number>,
  lost: boolean,
): number | null | undefined {
  const source = (side === 'before' ? ctx.leftPins : ctx.rightPins).get(pinKey(receiver, pin));
  if (!source) return undefined;
  const named = extended(ctx.rest, set);
  const positions = side === 'before' && ctx.oldNames.size > 0 ? translate(named, ctx.oldNames) : named;
  const value = channelValue(source.ch, source.cut, source.mixes, source.controls, positions);
  return pinPulse(pulseFor(source.travel, value), source.failsafe, lost);
}

function label(ctx: Context, set: Record<string, number>, lost: string[]): string {
  const parts: string[] = [];
  for (const [id, value] of Object.entries(set)) {
    if ((ctx.rest[id] ?? 0) === value) continue;
    parts.push(ctx.kinds.get(id) === 'switch' ? `${id} at position ${value}` : `${id} at ${percent(value)}`);
  }
  const where = parts.length === 0 ? REST_LABEL : `${parts.join(', ')}, the rest at rest`;
  if (lost.length === 0) return where;
  return `${where}, ${lost.map((id) => ctx.names.get(id) ?? id).join(' and ')} lost`;
}

/**
 * The axes along which to search: those whose coefficients differ between the forms,
 * or every axis when the travel or the cut differs (then any stick can show it).
 */
function changedAxes(left: ChannelForm, right: ChannelForm, axes: string[]): string[] {
  if (left.cut || right.cut) return axes;
  const t = left.travel;
  const u = right.travel;
  if (t.low_us !== u.low_us || t.center_us !== u.center_us || t.high_us !== u.high_us || t.reverse !== u.reverse)
    return axes;
  const differs = (name: string) =>
    Math.abs((left.a.get(name) ?? 0) - (right.a.get(name) ?? 0)) > 1e-9 ||
    Math.abs((left.b.get(name) ?? 0) - (right.b.get(name) ?? 0)) > 1e-9;
  const changed = axes.filter(differs);
  // Only the constant differs: any one axis carries the line.
  return changed.length > 0 ? changed : axes.slice(0, 1);
}

/**
 * A position (switches at `switches`, sticks along the lines searched) where the two
 * sources give different pulses with the link up; null when they agree everywhere.
 */
function livePoint(
  ctx: Context,
  receiver: string,
  pin: number,
  left: PinSource,
  right: PinSource,
  switches: Record<string, number>,
  globalOld: (id: string) => string,
): Record<string, number> | null {
  const leftForm = channelForm(left, switches, globalOld);
  const rightForm = channelForm(right, switches, (id) => id);
  if (sameForm(leftForm, rightForm)) return null;
  const allAxes = [...new Set([...axesOf(left, globalOld), ...axesOf(right, (id) => id)])];
  const axes = changedAxes(leftForm, rightForm, allAxes);
  const restX = new Map(allAxes.map((axis) => [axis, (ctx.rest[axis] ?? 0) / 100]));
  const check = (set: Record<string, number>) =>
    benchPulse(ctx, 'before', receiver, pin, set, false) !== benchPulse(ctx, 'after', receiver, pin, set, false);

  if (axes.length === 0) {
    return check(switches) ? { ...switches } : null;
  }
  // Along each axis in turn, the others at rest, then the others at each end.
  const holds: Map<string, number>[] = [restX];
  for (const other of axes) for (const end of [-1, 1]) holds.push(new Map(restX).set(other, end));
  for (const held of holds) {
    for (const axis of axes) {
      if (held.get(axis) !== restX.get(axis) && held !== restX) continue;
      let tried = 0;
      for (const x of witnesses(lineOf(leftForm, axis, held), lineOf(rightForm, axis, held))) {
        const set = extended(switches);
        for (const [name, value] of held) set[name] = value * 100;
        set[axis] = x * 100;
        if (check(set)) return set;
        if (++tried >= VERIFY_LIMIT) break;
      }
    }
  }
  return null;
}

/**
 * Which receiver pins behave differently in `after` than in `before`, at some position
 * of the controls or state of the link; empty exactly when none does. Every pin is
 * compared in every combination of the switches its channel depends on (on either
 * side), along each stick exactly (see pulse-witness.ts), and with its receiver lost.
 * Each entry names one position where the pin differs: one per switch combination for
 * the live link, one for the lost receiver. Both setups must be schema-valid.
 */
export function outputsDelta(before: Setup, after: Setup): OutputDelta[] {
  const oldNames = renamedControls(before, after);
  const newNames = new Map([...oldNames].map(([now, was]) => [was, now]));
  const globalOld = (id: string) => newNames.get(id) ?? id;
  const ctx: Context = {
    before,
    after,
    oldNames,
    rest: { ...translate(restPositions(before), newNames), ...restPositions(after) },
    kinds: new Map([
      ...before.controls.map((c) => [globalOld(c.id), c.kind] as const),
      ...after.controls.map((c) => [c.id, c.kind] as const),
    ]),
    names: receiverNames(before, after),
    globalOld,
    leftPins: pinSources(before, (id) => oldNames.get(id) ?? id),
    rightPins: pinSources(after, (id) => id),
  };
  const { leftPins, rightPins } = ctx;
  const deltas: OutputDelta[] = [];
  const push = (
    kind: OutputDelta['kind'],
    receiver: string,
    pin: number,
    set: Record<string, number>,
    lost: string[],
    left: PinSource | undefined,
    right: PinSource | undefined,
  ) => {
    const isLost = lost.length > 0;
    const beforeUs = left ? (benchPulse(ctx, 'before', receiver, pin, set, isLost) ?? null) : null;
    const afterUs = right ? (benchPulse(ctx, 'after', receiver, pin, set, isLost) ?? null) : null;
    const position = { label: label(ctx, set, lost), set, lost };
    deltas.push({
      kind,
      position,
      receiver,
      pin,
      ch_before: left?.ch ?? null,
      ch_after: right?.ch ?? null,
      before_us: beforeUs,
      after_us: afterUs,
      ...(kind === 'failsafe'
        ? { failsafe_before: left!.failsafe ?? null, failsafe_after: right!.failsafe ?? null }
        : {}),
      summary: `${ctx.names.get(receiver)} pin ${pin}, ${position.label}: ${pulseText(beforeUs, isLost)} -> ${pulseText(afterUs, isLost)}`,
    });
  };

  for (const { receiver, pin, key } of pinOrder(before, after)) {
    const left = leftPins.get(key);
    const right = rightPins.get(key);
    if (!left || !right) {
      // A pin on one side only: once, at rest.
      push('pulse', receiver, pin, {}, [], left, right);
      continue;
    }
    if (sameSource(left, right, globalOld)) continue;
    const switches = switchesOf(right, (id) => id);
    for (const [name, size] of switchesOf(left, globalOld)) switches.set(name, Math.max(size, switches.get(name) ?? 0));
    let liveAt: Record<string, number> | null = null;
    for (const state of combinations(switches)) {
      const point = livePoint(ctx, receiver, pin, left, right, state, globalOld);
      if (!point) continue;
      liveAt ??= point;
      push('pulse', receiver, pin, point, [], left, right);
    }
    const lost = lostPoint(ctx, receiver, pin, left, right, switches, liveAt);
    if (lost) push('failsafe', receiver, pin, lost, [receiver], left, right);
  }
  return deltas;
}

/**
 * A position where the pin sends something different once its receiver is lost; null
 * when it sends the same everywhere. Both `hold`: the held pulse is the live one, which
 * the live entries cover. A pulse against `hold` differs wherever the held pulse is
 * not that number: at rest, in some switch combination, or at the live witness.
 */
function lostPoint(
  ctx: Context,
  receiver: string,
  pin: number,
  left: PinSource,
  right: PinSource,
  switches: Map<string, number>,
  liveAt: Record<string, number> | null,
): Record<string, number> | null {
  const a = left.failsafe;
  const b = right.failsafe;
  if (a === 'hold' && b === 'hold') return null;
  if (a !== 'hold' && b !== 'hold') return pinPulse(0, a, true) === pinPulse(0, b, true) ? null : {};
  const differs = (set: Record<string, number>) =>
    benchPulse(ctx, 'before', receiver, pin, set, true) !== benchPulse(ctx, 'after', receiver, pin, set, true);
  const axes = [...new Set([...axesOf(right, (id) => id), ...axesOf(left, ctx.globalOld)])];
  const candidates: Record<string, number>[] = [];
  for (const state of combinations(switches)) {
    candidates.push(state);
    for (const axis of axes) for (const end of [-100, 100]) candidates.push(extended(state, { [axis]: end }));
  }
  if (liveAt) candidates.push(liveAt);
  return candidates.find(differs) ?? null;
}
