import type { Setup } from '../format/schema';
import { stopValue, throttleStop } from './throttle-stop';

/**
 * Evaluation rule 8, "at rest": every control at 0 (axes, knobs, sliders) or position
 * 0 (switches), except an axis, knob or slider that feeds a throttle channel, which
 * rests where that channel is at its stop: -100 for `stop: low`, 0 for `stop: center`.
 * A throttle stick rests at its stop, not at mid stick (half power whenever the cut is
 * off). A switch feeding a throttle stays at position 0: the rule names values, and a
 * switch's positions are its own choice. Only controls away from 0 are listed; every
 * other control sits at 0 or position 0 when evaluated.
 */
export function restPositions(setup: Setup): Record<string, number> {
  const rest: Record<string, number> = {};
  const kinds = new Map(setup.controls.map((control) => [control.id, control.kind]));
  for (const channel of setup.channels) {
    if (channel.role !== 'throttle') continue;
    const value = stopValue(throttleStop(channel, setup));
    for (const mix of setup.mixes) {
      if (mix.to !== channel.ch) continue;
      const kind = kinds.get(mix.from);
      if (kind === undefined || kind === 'switch' || Object.hasOwn(rest, mix.from)) continue;
      rest[mix.from] = value;
    }
  }
  return rest;
}

/** Rest with the given positions on top: what the bench shows for a few controls moved. */
export function fromRest(setup: Setup, positions: Readonly<Record<string, number>>): Record<string, number> {
  return { ...restPositions(setup), ...positions };
}
