import type { Setup } from '../format/schema';
import { ref, type Ref } from './refs';

export interface PositionUse {
  position: number;
  ref: Ref;
}

/** A place where the setup names a control, with the switch positions it uses there. */
export interface ControlReference {
  controlId: string;
  /** "mix ail-left" or "the cut of channel 3 (motor)". */
  owner: string;
  /** What the reference is for, in words. */
  use: 'input' | 'rates' | 'active' | 'cut';
  /** The `control` (or `from`) field. */
  ref: Ref;
  /** Switch positions used; rates give one per weight. */
  positions: PositionUse[];
  /** For rates: the list of weights. */
  listRef?: Ref;
}

export function controlReferences(setup: Setup): ControlReference[] {
  const refs: ControlReference[] = [];
  setup.mixes.forEach((mix, i) => {
    const owner = `mix ${mix.id}`;
    refs.push({ controlId: mix.from, owner, use: 'input', ref: ref.mix(setup, i, 'from'), positions: [] });
    if (mix.rates) {
      refs.push({
        controlId: mix.rates.control,
        owner,
        use: 'rates',
        ref: ref.mix(setup, i, 'rates', 'control'),
        positions: mix.rates.weights.map((_, p) => ({ position: p, ref: ref.mix(setup, i, 'rates', 'weights', p) })),
        listRef: ref.mix(setup, i, 'rates', 'weights'),
      });
    }
    if (mix.active) {
      refs.push({
        controlId: mix.active.control,
        owner,
        use: 'active',
        ref: ref.mix(setup, i, 'active', 'control'),
        positions: mix.active.positions.map((position, p) => ({ position, ref: ref.mix(setup, i, 'active', 'positions', p) })),
      });
    }
  });
  setup.channels.forEach((channel, i) => {
    if (!channel.cut) return;
    refs.push({
      controlId: channel.cut.control,
      owner: `the cut of channel ${channel.ch} (${channel.function})`,
      use: 'cut',
      ref: ref.channel(setup, i, 'cut', 'control'),
      positions: [{ position: channel.cut.position, ref: ref.channel(setup, i, 'cut', 'position') }],
    });
  });
  return refs;
}

export const USE_WORDS: Record<ControlReference['use'], string> = {
  input: 'as its input',
  rates: 'for its rates',
  active: 'to switch it on and off',
  cut: 'as its switch',
};
