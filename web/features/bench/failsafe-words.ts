import type { PinOutput } from '../../../shared/evaluate/evaluate';

/** What a pin does when the link is lost, in the words the bench and the sheet use. */
export function failsafeWords(failsafe: PinOutput['failsafe']): string {
  if (failsafe === null) return 'receiver default';
  if (failsafe === 'hold') return 'holds last pulse';
  if (failsafe === 'off') return 'stops pulses';
  return `${failsafe} us`;
}

/** The pin's pulse with the link lost: a set pulse, the held one, none, or the unit's own choice. */
export function pulseOnLinkLoss(pin: PinOutput): { pulse: number | null; note: string | null } {
  if (typeof pin.failsafe === 'number') return { pulse: pin.failsafe, note: null };
  if (pin.failsafe === 'hold') return { pulse: pin.pulse_us, note: 'held' };
  if (pin.failsafe === 'off') return { pulse: null, note: 'no pulse' };
  return { pulse: null, note: 'receiver default' };
}
