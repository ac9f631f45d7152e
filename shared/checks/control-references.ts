import type { Setup } from '../format/schema';
import { ref, type Ref } from './refs';

/**
 * A place where the setup names a control, with the switch positions it uses there.
 * Paths are built only when a check reports something, since most references are fine.
 */
export interface ControlReference {
  controlId: string;
  use: 'input' | 'rates' | 'active' | 'cut';
  /** Index of the mix (input, rates, active) or of the channel (cut). */
  index: number;
  /** Switch positions used; for rates, one per weight (0, 1, ...). */
  positions: readonly number[];
}

export function controlReferences(setup: Setup): ControlReference[] {
  const refs: ControlReference[] = [];
  setup.mixes.forEach((mix, index) => {
    refs.push({ controlId: mix.from, use: 'input', index, positions: [] });
    if (mix.rates) {
      refs.push({ controlId: mix.rates.control, use: 'rates', index, positions: mix.rates.weights.map((_, p) => p) });
    }
    if (mix.active) refs.push({ controlId: mix.active.control, use: 'active', index, positions: mix.active.positions });
  });
  setup.channels.forEach((channel, index) => {
    if (channel.cut)
      refs.push({ controlId: channel.cut.control, use: 'cut', index, positions: [channel.cut.position] });
  });
  return refs;
}

/** "mix ail-left" or "the cut of channel 3 (motor)". */
export function referenceOwner(setup: Setup, reference: ControlReference): string {
  if (reference.use === 'cut') {
    const channel = setup.channels[reference.index];
    return `the cut of channel ${channel.ch} (${channel.function})`;
  }
  return `mix ${setup.mixes[reference.index].id}`;
}

/** The field that names the control (`from` or `control`). */
export function referenceRef(setup: Setup, reference: ControlReference): Ref {
  switch (reference.use) {
    case 'input':
      return ref.mix(setup, reference.index, 'from');
    case 'rates':
      return ref.mix(setup, reference.index, 'rates', 'control');
    case 'active':
      return ref.mix(setup, reference.index, 'active', 'control');
    case 'cut':
      return ref.channel(setup, reference.index, 'cut', 'control');
  }
}

/** The field holding the i-th position used by the reference. */
export function positionRef(setup: Setup, reference: ControlReference, i: number): Ref {
  switch (reference.use) {
    case 'rates':
      return ref.mix(setup, reference.index, 'rates', 'weights', i);
    case 'active':
      return ref.mix(setup, reference.index, 'active', 'positions', i);
    case 'cut':
      return ref.channel(setup, reference.index, 'cut', 'position');
    case 'input':
      return ref.mix(setup, reference.index, 'from');
  }
}

export const USE_WORDS: Record<ControlReference['use'], string> = {
  input: 'as its input',
  rates: 'for its rates',
  active: 'to switch it on and off',
  cut: 'as its switch',
};
