import type { PinOutput } from '@shared/evaluate/evaluate';

/** What a pin is set to do when its receiver loses the link, in the words the bench and the sheet use. */
export function failsafeWords(failsafe: PinOutput['failsafe']): string {
  if (failsafe === null) return 'receiver default';
  if (failsafe === 'hold') return 'holds last pulse';
  if (failsafe === 'off') return 'stops pulses';
  return `${failsafe} µs`;
}

export type PinStateKind = 'live' | 'failsafe' | 'held' | 'no-pulses' | 'receiver-default';

/**
 * What a pin is doing now (evaluation rule 9): following the controls while its
 * receiver has the link; once lost, sending its failsafe pulse, holding the pulse it
 * had, sending nothing (`off`), or whatever the unit itself was set to (unset).
 */
export function pinState(pin: PinOutput, lost: boolean): { kind: PinStateKind; words: string } {
  if (!lost) return { kind: 'live', words: 'live' };
  if (pin.failsafe === 'hold') return { kind: 'held', words: 'held' };
  if (pin.failsafe === 'off') return { kind: 'no-pulses', words: 'no pulses' };
  if (pin.failsafe === null) return { kind: 'receiver-default', words: 'receiver default (not known)' };
  return { kind: 'failsafe', words: `failsafe (${pin.failsafe} µs)` };
}
