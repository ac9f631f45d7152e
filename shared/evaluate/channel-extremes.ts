import type { Control, Mix } from '../format/schema';

// The exact extremes of a channel's mix sum before clamping, over every combination of
// control positions. Switches take their discrete positions. An axis (knob, slider)
// feeds each of its mixes w * ((1 - k) x + k x^3), so all the mixes on one channel from
// one axis add up to A x + B x^3 for the current switch states; its extremes on
// -1..1 lie at x = +-1 or where the slope A + 3 B x^2 is zero, and are found exactly
// from those candidates. With a single mix (or mixes of one sign) the cubic expo is
// monotonic for expo 0..100 and the extremes are simply the stick's ends.
//
// Mixes are split into groups that share no control; groups vary independently, so the
// channel's extreme is the sum of the groups' extremes and only the switches within a
// group are enumerated together.

/** Groups with more switch combinations than this are bounded instead of enumerated. */
export const COMBINATION_LIMIT = 59049;

export interface Extreme {
  /** Percent before clamping. */
  value: number;
  /** Switch positions (0-based) and axis values (percent) that reach it, by control id. */
  setting: Record<string, number>;
}

export interface ChannelExtremes {
  max: Extreme;
  min: Extreme;
  /** False when some group had too many combinations and was bounded per mix instead. */
  exact: boolean;
  /** The switches that take part, by id. */
  switches: string[];
  /** The axes, knobs and sliders that take part, by id. */
  axes: string[];
}

interface CompiledMix {
  mix: Mix;
  fromAxis: number;
  fromSwitch: number;
  activeSwitch: number;
  ratesSwitch: number;
  k: number;
}

interface Variables {
  switches: string[];
  switchPositions: number[];
  axes: string[];
}

function isSwitch(control: Control | undefined): control is Control & { kind: 'switch' } {
  return control !== undefined && control.kind === 'switch';
}

/**
 * Where A x + B x^3 is highest (sign 1) or lowest (sign -1) on -1..1: at an end, or
 * where its slope A + 3 B x^2 is zero. The function is odd, so f(-x) = -f(x).
 */
function extremeX(a: number, b: number, sign: number): number {
  let bestX = 1;
  let best = sign * (a + b);
  if (-best > best + 1e-12) {
    best = -best;
    bestX = -1;
  }
  if (b !== 0) {
    const square = -a / (3 * b);
    if (square > 0 && square < 1) {
      const root = Math.sqrt(square);
      const atRoot = sign * (a * root + b * root * root * root);
      if (atRoot > best + 1e-12) {
        best = atRoot;
        bestX = root;
      }
      if (-atRoot > best + 1e-12) bestX = -root;
    }
  }
  return bestX;
}

function cubic(a: number, b: number, x: number): number {
  return a * x + b * x * x * x;
}

function switchValue(position: number, positions: number): number {
  return -1 + (2 * position) / (positions - 1);
}

class UnionFind {
  private parent = new Map<string, string>();
  find(key: string): string {
    let root = key;
    while (this.parent.has(root) && this.parent.get(root) !== root) root = this.parent.get(root)!;
    if (!this.parent.has(key)) this.parent.set(key, key);
    return root;
  }
  union(a: string, b: string): void {
    const ra = this.find(a);
    const rb = this.find(b);
    if (ra !== rb) this.parent.set(ra, rb);
  }
}

function weightAt(mix: Mix, position: number): number {
  return mix.rates ? (mix.rates.weights[position] ?? mix.weight) : mix.weight;
}

interface GroupResult {
  max: Extreme;
  min: Extreme;
  exact: boolean;
}

function solveGroup(mixes: CompiledMix[], vars: Variables): GroupResult {
  const n = vars.switches.length;
  let combinations = 1;
  for (const p of vars.switchPositions) combinations *= p;
  if (combinations > COMBINATION_LIMIT) return boundGroup(mixes, vars);

  const position = new Array<number>(n).fill(0);
  const axisCount = vars.axes.length;
  const a = new Array<number>(axisCount).fill(0);
  const b = new Array<number>(axisCount).fill(0);
  let max: Extreme = { value: -Infinity, setting: {} };
  let min: Extreme = { value: Infinity, setting: {} };

  for (let combo = 0; combo < combinations; combo += 1) {
    a.fill(0);
    b.fill(0);
    let constant = 0;
    for (const m of mixes) {
      const mix = m.mix;
      if (mix.active && !mix.active.positions.includes(m.activeSwitch >= 0 ? position[m.activeSwitch] : 0)) continue;
      const w = weightAt(mix, m.ratesSwitch >= 0 ? position[m.ratesSwitch] : 0);
      constant += mix.offset;
      if (m.fromAxis >= 0) {
        a[m.fromAxis] += w * (1 - m.k);
        b[m.fromAxis] += w * m.k;
      } else if (m.fromSwitch >= 0) {
        const x = switchValue(position[m.fromSwitch], vars.switchPositions[m.fromSwitch]);
        constant += w * cubic(1 - m.k, m.k, x);
      }
    }
    let high = constant;
    let low = constant;
    for (let i = 0; i < axisCount; i += 1) {
      high += cubic(a[i], b[i], extremeX(a[i], b[i], 1));
      low += cubic(a[i], b[i], extremeX(a[i], b[i], -1));
    }
    if (high > max.value + 1e-9) max = { value: high, setting: settingOf(vars, position, a, b, 1) };
    if (low < min.value - 1e-9) min = { value: low, setting: settingOf(vars, position, a, b, -1) };

    for (let i = 0; i < n; i += 1) {
      position[i] += 1;
      if (position[i] < vars.switchPositions[i]) break;
      position[i] = 0;
    }
  }
  return { max, min, exact: true };
}

function settingOf(
  vars: Variables,
  position: readonly number[],
  a: readonly number[],
  b: readonly number[],
  sign: number,
) {
  const setting: Record<string, number> = {};
  for (let i = 0; i < vars.switches.length; i += 1) setting[vars.switches[i]] = position[i];
  for (let i = 0; i < vars.axes.length; i += 1) {
    // An axis with no effect in this combination is left out of the description.
    if (a[i] !== 0 || b[i] !== 0) setting[vars.axes[i]] = Math.round(extremeX(a[i], b[i], sign) * 100);
  }
  return setting;
}

/** An upper and lower bound: each mix at its own extreme, as if its controls were free. */
function boundGroup(mixes: CompiledMix[], vars: Variables): GroupResult {
  let high = 0;
  let low = 0;
  for (const m of mixes) {
    const own = isolate(m, vars);
    const result = solveGroup([own.compiled], own.variables);
    high += result.max.value;
    low += result.min.value;
  }
  return { max: { value: high, setting: {} }, min: { value: low, setting: {} }, exact: false };
}

/** One mix with its own variables only (at most three switches and one axis). */
function isolate(m: CompiledMix, vars: Variables): { compiled: CompiledMix; variables: Variables } {
  const used = [...new Set([m.fromSwitch, m.activeSwitch, m.ratesSwitch].filter((i) => i >= 0))];
  const local = (i: number) => (i >= 0 ? used.indexOf(i) : -1);
  return {
    compiled: {
      ...m,
      fromSwitch: local(m.fromSwitch),
      activeSwitch: local(m.activeSwitch),
      ratesSwitch: local(m.ratesSwitch),
      fromAxis: m.fromAxis >= 0 ? 0 : -1,
    },
    variables: {
      switches: used.map((i) => vars.switches[i]),
      switchPositions: used.map((i) => vars.switchPositions[i]),
      axes: m.fromAxis >= 0 ? [vars.axes[m.fromAxis]] : [],
    },
  };
}

/**
 * The highest and lowest sum of `mixes` (all feeding one channel) over every setting
 * of the controls. References to missing controls, or switch uses of controls that are
 * not switches, sit at 0 / position 0 as in evaluation.
 */
export function channelExtremes(mixes: readonly Mix[], controls: ReadonlyMap<string, Control>): ChannelExtremes {
  const groups = new UnionFind();
  const constantKey = '\u0000constant';
  const keysOf = (mix: Mix): string[] => {
    const keys: string[] = [];
    const from = controls.get(mix.from);
    if (from) keys.push(mix.from);
    if (mix.rates && isSwitch(controls.get(mix.rates.control))) keys.push(mix.rates.control);
    if (mix.active && isSwitch(controls.get(mix.active.control))) keys.push(mix.active.control);
    return keys.length > 0 ? keys : [constantKey];
  };
  for (const mix of mixes) {
    const keys = keysOf(mix);
    for (const key of keys) groups.union(keys[0], key);
  }

  const byGroup = new Map<string, Mix[]>();
  for (const mix of mixes) {
    const root = groups.find(keysOf(mix)[0]);
    const list = byGroup.get(root);
    if (list) list.push(mix);
    else byGroup.set(root, [mix]);
  }

  const total: ChannelExtremes = {
    max: { value: 0, setting: {} },
    min: { value: 0, setting: {} },
    exact: true,
    switches: [],
    axes: [],
  };
  for (const groupMixes of byGroup.values()) {
    const vars: Variables = { switches: [], switchPositions: [], axes: [] };
    const switchIndex = (id: string | undefined): number => {
      if (id === undefined) return -1;
      const control = controls.get(id);
      if (!isSwitch(control)) return -1;
      let i = vars.switches.indexOf(id);
      if (i < 0) {
        i = vars.switches.push(id) - 1;
        vars.switchPositions.push(control.positions);
      }
      return i;
    };
    const compiled = groupMixes.map((mix): CompiledMix => {
      const from = controls.get(mix.from);
      let fromAxis = -1;
      if (from && from.kind !== 'switch') {
        fromAxis = vars.axes.indexOf(mix.from);
        if (fromAxis < 0) fromAxis = vars.axes.push(mix.from) - 1;
      }
      return {
        mix,
        fromAxis,
        fromSwitch: from && from.kind === 'switch' ? switchIndex(mix.from) : -1,
        activeSwitch: switchIndex(mix.active?.control),
        ratesSwitch: switchIndex(mix.rates?.control),
        k: mix.expo / 100,
      };
    });
    const result = solveGroup(compiled, vars);
    total.max.value += result.max.value;
    total.min.value += result.min.value;
    Object.assign(total.max.setting, result.max.setting);
    Object.assign(total.min.setting, result.min.setting);
    total.exact &&= result.exact;
    total.switches.push(...vars.switches);
    total.axes.push(...vars.axes);
  }
  return total;
}
