import {
  DEFAULT_TRAVEL,
  type Channel,
  type Control,
  type Failsafe,
  type Mix,
  type Setup,
  type Travel,
} from '../format/schema';
import { controlsById, controlValue, switchPositionOf, type Positions } from './control-value';
import { expoCurve } from './expo-curve';

export { controlValue } from './control-value';
export type { Positions } from './control-value';

export interface ChannelOutput {
  ch: number;
  function: string;
  /** Percent after clamping and cut, rounded to 0.01. */
  value: number;
  pulse_us: number;
}

export interface PinOutput {
  pin: number;
  ch: number;
  /** null when the receiver has lost the link and the pin sends nothing (`off`) or its default (unset). */
  pulse_us: number | null;
  failsafe: number | 'hold' | 'off' | null;
}

export interface ReceiverOutput {
  id: string;
  /** Whether this receiver has lost the link (evaluation rule 9). */
  lost: boolean;
  pins: PinOutput[];
}

/** Which receivers have lost the link: none, some by id, or all of them. */
export type LinkLoss = ReadonlySet<string> | 'all';

export interface Outputs {
  channels: ChannelOutput[];
  receivers: ReceiverOutput[];
}

/** The weight a mix uses: its `rates` weight for the rates switch's position, else `weight`. */
export function mixWeight(mix: Mix, controls: ReadonlyMap<string, Control>, positions: Positions): number {
  if (!mix.rates) return mix.weight;
  const weight = mix.rates.weights[switchPositionOf(controls, mix.rates.control, positions)];
  // A position without a rates weight (reported by `position-out-of-range`) keeps `weight`.
  return weight ?? mix.weight;
}

export function mixIsActive(mix: Mix, controls: ReadonlyMap<string, Control>, positions: Positions): boolean {
  if (!mix.active) return true;
  return mix.active.positions.includes(switchPositionOf(controls, mix.active.control, positions));
}

/** The value in percent of the control `id`; a missing control sits at 0. */
export function valueOf(controls: ReadonlyMap<string, Control>, id: string, positions: Positions): number {
  const control = controls.get(id);
  return control ? controlValue(control, positions[id]) : 0;
}

/** An active mix contributes w * curve(x) + offset; an inactive one nothing. */
export function mixContribution(mix: Mix, controls: ReadonlyMap<string, Control>, positions: Positions): number {
  if (!mixIsActive(mix, controls, positions)) return 0;
  const x = valueOf(controls, mix.from, positions) / 100;
  return mixWeight(mix, controls, positions) * expoCurve(x, mix.expo) + mix.offset;
}

function clampPercent(value: number): number {
  return Math.min(100, Math.max(-100, value));
}

/** The sum of a channel's active mixes, clamped, then replaced by its cut when the cut is on. */
export function channelValue(
  ch: number,
  cut: Channel['cut'],
  mixes: readonly Mix[],
  controls: ReadonlyMap<string, Control>,
  positions: Positions,
): number {
  let sum = 0;
  for (const mix of mixes) if (mix.to === ch) sum += mixContribution(mix, controls, positions);
  const value = clampPercent(sum);
  if (cut && switchPositionOf(controls, cut.control, positions) === cut.position) return cut.value;
  return value;
}

/** The pulse in microseconds for channel value v (percent) through a travel. */
export function pulseFor(travel: Travel, value: number): number {
  return roundPulse(unroundedPulse(travel, value));
}

/** The pulse before rounding: linear in v on each side of centre (rule 5). */
export function unroundedPulse(travel: Travel, value: number): number {
  const v = travel.reverse ? -value : value;
  return v >= 0
    ? travel.center_us + (v / 100) * (travel.high_us - travel.center_us)
    : travel.center_us + (v / 100) * (travel.center_us - travel.low_us);
}

/** Rounds a pulse to the nearest microsecond as rule 5 does. */
export function roundPulse(pulse: number): number {
  // clean() moves a value by at most 5e-12 of itself, so away from a half it cannot
  // change the rounding and Math.round alone gives the same answer without the string
  // round trip (the outputs search rounds thousands of pulses per compare). Zero goes
  // the long way too: clean() turns -0 into 0.
  const fromHalf = Math.abs(pulse - Math.floor(pulse) - 0.5);
  if (pulse !== 0 && fromHalf > 1e-9 * Math.max(1, Math.abs(pulse))) return Math.round(pulse);
  return Math.round(clean(pulse));
}

/** A channel's idle pulse: its pulse at v = -100 (low_us, or high_us when reversed). */
export function idlePulse(travel: Travel): number {
  return pulseFor(travel, -100);
}

// Drops floating-point noise before rounding, so that a value worked by hand to end in
// 5 (27.125) rounds as on paper rather than as 27.124999999999996 would.
function clean(value: number): number {
  return Number(value.toPrecision(12));
}

function round2(value: number): number {
  const rounded = Math.round(clean(value) * 100) / 100;
  return rounded === 0 ? 0 : rounded;
}

/**
 * Evaluation rule 9: what a pin sends. A receiver with the link follows the controls;
 * a lost one sends the failsafe pulse, for `hold` the pulse it had when the link went
 * (the pulse of the current positions), and nothing for `off` or an unset failsafe
 * (the receiver's own default, which the setup does not know).
 */
export function pinPulse(live: number, failsafe: Failsafe, lost: boolean): number | null {
  if (!lost || failsafe === 'hold') return live;
  return typeof failsafe === 'number' ? failsafe : null;
}

/**
 * The bench view: every channel's value and pulse, and every receiver pin's pulse and
 * failsafe, with the receivers in `lost` out of the link. Controls missing from
 * `positions` sit at 0 or position 0; callers that start from rest pass
 * `fromRest(setup, positions)`.
 */
export function evaluate(setup: Setup, positions: Positions = {}, lost: LinkLoss = new Set()): Outputs {
  const controls = controlsById(setup.controls);
  const mixesByTarget = new Map<number, Mix[]>();
  for (const mix of setup.mixes) {
    const list = mixesByTarget.get(mix.to);
    if (list) list.push(mix);
    else mixesByTarget.set(mix.to, [mix]);
  }

  const channels = [...setup.channels]
    .sort((a, b) => a.ch - b.ch)
    .map((channel) => {
      const value = channelValue(channel.ch, channel.cut, mixesByTarget.get(channel.ch) ?? [], controls, positions);
      return {
        ch: channel.ch,
        function: channel.function,
        value: round2(value),
        pulse_us: pulseFor(channel.travel, value),
      };
    });

  const pulseByCh = new Map<number, number>();
  // A pin follows the first plan entry on its channel; an unplanned channel uses the
  // default travel and no cut.
  for (const channel of setup.channels) {
    if (pulseByCh.has(channel.ch)) continue;
    const value = channelValue(channel.ch, channel.cut, mixesByTarget.get(channel.ch) ?? [], controls, positions);
    pulseByCh.set(channel.ch, pulseFor(channel.travel, value));
  }
  const pulseOf = (ch: number): number => {
    const known = pulseByCh.get(ch);
    if (known !== undefined) return known;
    const value = channelValue(ch, undefined, mixesByTarget.get(ch) ?? [], controls, positions);
    const pulse = pulseFor(DEFAULT_TRAVEL, value);
    pulseByCh.set(ch, pulse);
    return pulse;
  };

  const receivers = setup.receivers.map((receiver) => {
    const isLost = lost === 'all' || lost.has(receiver.id);
    return {
      id: receiver.id,
      lost: isLost,
      pins: [...receiver.map]
        .sort((a, b) => a.pin - b.pin)
        .map((entry) => ({
          pin: entry.pin,
          ch: entry.ch,
          pulse_us: pinPulse(pulseOf(entry.ch), entry.failsafe, isLost),
          failsafe: failsafeOut(entry.failsafe),
        })),
    };
  });

  return { channels, receivers };
}

function failsafeOut(failsafe: Failsafe): PinOutput['failsafe'] {
  return failsafe === undefined ? null : failsafe;
}
