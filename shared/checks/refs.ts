import type { Setup } from '../format/schema';
import type { DataPath } from '../parse/semantic-path';

export interface Ref {
  path: string;
  at: DataPath;
}

type Tail = (string | number)[];

function tailText(tail: Tail): string {
  return tail.map((step) => (typeof step === 'number' ? `[${step}]` : `.${step}`)).join('');
}

// Semantic path plus exact data path for entries of the setup's lists; the data path
// tells two entries with the same identity apart.
export const ref = {
  root: (...tail: Tail): Ref => ({ path: tailText(tail).replace(/^\./, ''), at: tail }),
  control: (setup: Setup, i: number, ...tail: Tail): Ref => ({
    path: `controls[id=${setup.controls[i].id}]${tailText(tail)}`,
    at: ['controls', i, ...tail],
  }),
  channel: (setup: Setup, i: number, ...tail: Tail): Ref => ({
    path: `channels[ch=${setup.channels[i].ch}]${tailText(tail)}`,
    at: ['channels', i, ...tail],
  }),
  mix: (setup: Setup, i: number, ...tail: Tail): Ref => ({
    path: `mixes[id=${setup.mixes[i].id}]${tailText(tail)}`,
    at: ['mixes', i, ...tail],
  }),
  receiver: (setup: Setup, i: number, ...tail: Tail): Ref => ({
    path: `receivers[id=${setup.receivers[i].id}]${tailText(tail)}`,
    at: ['receivers', i, ...tail],
  }),
  pin: (setup: Setup, ri: number, pi: number, ...tail: Tail): Ref => ({
    path: `receivers[id=${setup.receivers[ri].id}].map[pin=${setup.receivers[ri].map[pi].pin}]${tailText(tail)}`,
    at: ['receivers', ri, 'map', pi, ...tail],
  }),
};
