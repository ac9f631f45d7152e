import { controlsById } from '../evaluate/control-value';
import {
  DEFAULT_TRAVEL,
  type Channel,
  type Control,
  type Failsafe,
  type Mix,
  type Setup,
  type Travel,
} from '../format/schema';
import { deepEqual } from './plain';

// What one receiver pin does, written so that two revisions can be compared exactly.
// For fixed switch positions a channel's sum of mixes is c + sum over axes of
// (A_i x_i + B_i x_i^3): every mix from an axis, knob or slider adds w (1 - k) to A and
// w k to B of its input (the cubic expo), every mix from a switch and every offset adds
// a constant. The pulse is then clamp, cut and the travel's two linear halves.

/** A pin of one revision: the channel it carries and how that channel is made. */
export interface PinSource {
  ch: number;
  failsafe: Failsafe;
  travel: Travel;
  cut: Channel['cut'];
  mixes: Mix[];
  controls: Map<string, Control>;
  /** This revision's control id for a control named as in the new revision. */
  localName: (id: string) => string;
}

/** The channel at one setting of its switches: a cut's constant, or the polynomial form. */
export type ChannelForm =
  | { cut: true; value: number; travel: Travel }
  | { cut: false; constant: number; a: Map<string, number>; b: Map<string, number>; travel: Travel };

export function pinSources(setup: Setup, localName: (id: string) => string): Map<string, PinSource> {
  const controls = controlsById(setup.controls);
  const plan = new Map<number, Channel>();
  for (const channel of setup.channels) if (!plan.has(channel.ch)) plan.set(channel.ch, channel);
  const mixes = new Map<number, Mix[]>();
  for (const mix of setup.mixes) {
    const same = mixes.get(mix.to);
    if (same) same.push(mix);
    else mixes.set(mix.to, [mix]);
  }
  const pins = new Map<string, PinSource>();
  for (const receiver of setup.receivers) {
    for (const entry of receiver.map) {
      const key = pinKey(receiver.id, entry.pin);
      // A duplicate pin (reported by duplicate-id) keeps its first entry, as the bench does.
      if (pins.has(key)) continue;
      const channel = plan.get(entry.ch);
      pins.set(key, {
        ch: entry.ch,
        failsafe: entry.failsafe,
        // An unplanned channel uses the default travel and no cut, as in evaluation.
        travel: channel?.travel ?? { ...DEFAULT_TRAVEL },
        cut: channel?.cut,
        mixes: mixes.get(entry.ch) ?? [],
        controls,
        localName,
      });
    }
  }
  return pins;
}

export function pinKey(receiver: string, pin: number): string {
  return `${receiver}\u0000${pin}`;
}

/** The switches (new-revision names, with their position counts) that the pin's channel depends on. */
export function switchesOf(source: PinSource, globalName: (id: string) => string): Map<string, number> {
  const found = new Map<string, number>();
  const note = (id: string | undefined) => {
    if (id === undefined) return;
    const control = source.controls.get(id);
    if (control?.kind === 'switch') {
      const name = globalName(id);
      found.set(name, Math.max(found.get(name) ?? 0, control.positions));
    }
  };
  for (const mix of source.mixes) {
    note(mix.from);
    note(mix.rates?.control);
    note(mix.active?.control);
  }
  note(source.cut?.control);
  return found;
}

/** The axes, knobs and sliders (new-revision names) that feed the pin's channel. */
export function axesOf(source: PinSource, globalName: (id: string) => string): string[] {
  const axes = new Set<string>();
  for (const mix of source.mixes) {
    const control = source.controls.get(mix.from);
    if (control && control.kind !== 'switch') axes.add(globalName(mix.from));
  }
  return [...axes];
}

function positionOf(
  source: PinSource,
  id: string,
  switches: Readonly<Record<string, number>>,
  localToGlobal: (id: string) => string,
) {
  const control = source.controls.get(id);
  if (!control || control.kind !== 'switch') return 0;
  const p = Math.round(switches[localToGlobal(id)] ?? 0);
  return Math.min(control.positions - 1, Math.max(0, p));
}

/** The channel's form at the given switch positions (new-revision names). */
export function channelForm(
  source: PinSource,
  switches: Readonly<Record<string, number>>,
  globalName: (id: string) => string,
): ChannelForm {
  const at = (id: string) => positionOf(source, id, switches, globalName);
  if (source.cut && at(source.cut.control) === source.cut.position)
    return { cut: true, value: source.cut.value, travel: source.travel };
  let constant = 0;
  const a = new Map<string, number>();
  const b = new Map<string, number>();
  for (const mix of source.mixes) {
    if (mix.active && !mix.active.positions.includes(at(mix.active.control))) continue;
    const w = mix.rates ? (mix.rates.weights[at(mix.rates.control)] ?? mix.weight) : mix.weight;
    const k = mix.expo / 100;
    constant += mix.offset;
    const from = source.controls.get(mix.from);
    if (!from) continue;
    if (from.kind === 'switch') {
      const x = -1 + (2 * at(mix.from)) / (from.positions - 1);
      constant += w * ((1 - k) * x + k * x * x * x);
    } else {
      const name = globalName(mix.from);
      a.set(name, (a.get(name) ?? 0) + w * (1 - k));
      b.set(name, (b.get(name) ?? 0) + w * k);
    }
  }
  return { cut: false, constant, a, b, travel: source.travel };
}

const EPSILON = 1e-9;

function sameTravel(left: Travel, right: Travel): boolean {
  return (
    left.low_us === right.low_us &&
    left.center_us === right.center_us &&
    left.high_us === right.high_us &&
    left.reverse === right.reverse
  );
}

function sameCoefficients(left: Map<string, number>, right: Map<string, number>): boolean {
  for (const [key, value] of left) if (Math.abs(value - (right.get(key) ?? 0)) > EPSILON) return false;
  for (const [key, value] of right) if (!left.has(key) && Math.abs(value) > EPSILON) return false;
  return true;
}

/**
 * True when the two forms are the same function of the sticks: same travel and the
 * same cut value, or the same polynomial coefficients. Two sums of cubics in separate
 * variables are equal everywhere exactly when their coefficients are (a polynomial
 * that vanishes on a box is the zero polynomial), so this decides equality of the
 * channel value before clamping; with equal travels the pulses are then equal too.
 * Sums are compared to 1e-9 % because the same mixes added in another order may
 * differ in the last bit.
 */
export function sameForm(left: ChannelForm, right: ChannelForm): boolean {
  if (!sameTravel(left.travel, right.travel)) return false;
  if (left.cut || right.cut) return left.cut && right.cut && left.value === right.value;
  return (
    Math.abs(left.constant - right.constant) <= EPSILON &&
    sameCoefficients(left.a, right.a) &&
    sameCoefficients(left.b, right.b)
  );
}

/** The controls a pin's channel reads: its mixes' inputs, rates and active switches, and its cut's switch. */
function controlsRead(source: PinSource): Set<string> {
  const ids = new Set<string>();
  for (const mix of source.mixes) {
    ids.add(mix.from);
    if (mix.rates) ids.add(mix.rates.control);
    if (mix.active) ids.add(mix.active.control);
  }
  if (source.cut) ids.add(source.cut.control);
  return ids;
}

/**
 * True when the two pins are made identically: the same channel, failsafe, travel and
 * cut, equal mixes in the same order, and every control they read equal and not
 * renamed. Such pins send the same pulse at every position and link state, so the
 * outputs delta has nothing to look for there; anything less goes through the search.
 */
export function sameSource(left: PinSource, right: PinSource, globalName: (id: string) => string): boolean {
  if (left.ch !== right.ch || !deepEqual(left.failsafe, right.failsafe)) return false;
  if (!deepEqual(left.travel, right.travel) || !deepEqual(left.cut ?? null, right.cut ?? null)) return false;
  if (!deepEqual(left.mixes, right.mixes)) return false;
  for (const id of controlsRead(left)) {
    if (globalName(id) !== id || !deepEqual(left.controls.get(id) ?? null, right.controls.get(id) ?? null))
      return false;
  }
  return true;
}
