import type { Channel, Setup, ThrottleStop } from '../format/schema';
import { pulseFor } from './evaluate';

// Evaluation rule 7 (second edition). A forward/reverse speed controller in a car or a
// boat stops at the centre pulse, and its low end is full reverse; everything else
// stops at the low end. Common practice, no published standard (docs/sources.md, second
// edition).
const CENTRE_STOP_AIRFRAMES = new Set<Setup['model']['airframe']>(['car', 'boat']);

/** Where the channel's motor stops: its own `stop`, else the airframe's default. */
export function throttleStop(channel: Pick<Channel, 'stop'>, setup: Pick<Setup, 'model'>): ThrottleStop {
  return channel.stop ?? (CENTRE_STOP_AIRFRAMES.has(setup.model.airframe) ? 'center' : 'low');
}

/** The channel value in percent at which the motor stops: -100 for `low`, 0 for `center`. */
export function stopValue(stop: ThrottleStop): number {
  return stop === 'low' ? -100 : 0;
}

/** The stop pulse: the pulse at v = -100 for `stop: low`, `center_us` for `stop: center`. */
export function stopPulse(channel: Pick<Channel, 'stop' | 'travel'>, setup: Pick<Setup, 'model'>): number {
  return pulseFor(channel.travel, stopValue(throttleStop(channel, setup)));
}

/** The motor of a powered model: `model.motor`, or electric when it is not given. */
export function motorOf(setup: Pick<Setup, 'model'>): NonNullable<Setup['model']['motor']> {
  return setup.model.motor ?? 'electric';
}
