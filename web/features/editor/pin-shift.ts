import type { DocumentEdit } from '@shared/edit/document-edits';
import { wholeNumber, type Indexed } from './form-values';

const HIGHEST_CHANNEL = 32;

export type ShiftResult =
  { edits: DocumentEdit[]; summary: string; error?: undefined } | { edits?: undefined; error: string };

/** "1-8" for a run, "1, 3, 5-6" otherwise. */
function describeNumbers(numbers: readonly number[]): string {
  const sorted = [...numbers].sort((a, b) => a - b);
  const runs: string[] = [];
  for (let i = 0; i < sorted.length;) {
    let j = i;
    while (j + 1 < sorted.length && sorted[j + 1] === sorted[j] + 1) j += 1;
    runs.push(j === i ? String(sorted[i]) : `${sorted[i]}-${sorted[j]}`);
    i = j + 1;
  }
  return runs.join(', ');
}

/**
 * Moves the selected map entries of receiver `receiverIndex` by `by` channels: the
 * second receiver of a 16-channel plan copied from the first (pins 1-8 on channels
 * 1-8) shifted by 8 carries 9-16. Every entry moves or none does.
 */
export function shiftPinChannels(receiverIndex: number, selected: readonly Indexed[], by: number): ShiftResult {
  if (selected.length === 0) return { error: 'Select the pins to shift first.' };
  if (!Number.isInteger(by) || by === 0)
    return { error: 'Shift by a whole number of channels other than 0, like 8 or -8.' };
  const edits: DocumentEdit[] = [];
  const pins: number[] = [];
  const channels: number[] = [];
  for (const { index, entry } of selected) {
    const ch = wholeNumber(entry.ch);
    const pin = wholeNumber(entry.pin);
    const name = pin === null ? `the entry at position ${index + 1}` : `pin ${pin}`;
    if (ch === null) return { error: `The channel of ${name} is not a whole number; fix it first.` };
    const next = ch + by;
    if (next < 1 || next > HIGHEST_CHANNEL) {
      return { error: `Channel ${ch} of ${name} would become ${next}; channels go from 1 to ${HIGHEST_CHANNEL}.` };
    }
    edits.push({ kind: 'set', path: ['receivers', receiverIndex, 'map', index, 'ch'], value: next });
    if (pin !== null) pins.push(pin);
    channels.push(next);
  }
  const one = selected.length === 1;
  const who =
    pins.length === selected.length
      ? `${one ? 'Pin' : 'Pins'} ${describeNumbers(pins)}`
      : `${selected.length} map entries`;
  return { edits, summary: `${who} now ${one ? 'carries channel' : 'carry channels'} ${describeNumbers(channels)}.` };
}
