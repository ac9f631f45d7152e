import type { Check, CheckResult } from './check';
import { capitalize } from './context';
import { controlReferences } from './control-references';

function positionWords(positions: number): string {
  return positions === 2 ? 'positions 0 and 1' : `positions 0 to ${positions - 1}`;
}

export const positionOutOfRange: Check = {
  id: 'position-out-of-range',
  severity: 'error',
  description: 'A switch position in rates weights, active positions or a cut that the switch does not have.',
  check(setup, ctx) {
    const results: CheckResult[] = [];
    for (const reference of controlReferences(setup)) {
      const control = ctx.controls.get(reference.controlId);
      if (reference.use === 'input' || !control || control.kind !== 'switch') continue;
      const n = control.positions;
      if (reference.use === 'rates') {
        const count = reference.positions.length;
        if (count > n) {
          results.push({
            message: `${capitalize(reference.owner)} gives ${count} rates weights, but ${control.id} has only ${n} positions (${positionWords(n)}); weight ${count} is never used.`,
            hint: `Give exactly ${n} weights, one per position of ${control.id}.`,
            ...reference.positions[n].ref,
          });
        } else if (count < n && reference.listRef) {
          results.push({
            message: `${capitalize(reference.owner)} gives ${count} rates weights, but ${control.id} has ${n} positions; at position ${n - 1} the mix falls back to its weight.`,
            hint: `Give exactly ${n} weights, one per position of ${control.id}.`,
            ...reference.listRef,
          });
        }
        continue;
      }
      for (const use of reference.positions) {
        if (use.position < n) continue;
        results.push({
          message: `${capitalize(reference.owner)} uses position ${use.position} of ${control.id}, which has only ${positionWords(n)}, so that setting can never happen.`,
          hint: `Use a position from 0 to ${n - 1}.`,
          ...use.ref,
        });
      }
    }
    return results;
  },
};
