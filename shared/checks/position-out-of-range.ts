import type { Check, CheckResult } from './check';
import { capitalize } from './context';
import { positionRef, referenceOwner } from './control-references';
import { ref } from './refs';

function positionWords(positions: number): string {
  return positions === 2 ? 'positions 0 and 1' : `positions 0 to ${positions - 1}`;
}

export const positionOutOfRange: Check = {
  id: 'position-out-of-range',
  severity: 'error',
  description: 'A switch position in rates weights, active positions or a cut that the switch does not have.',
  check(setup, ctx) {
    const results: CheckResult[] = [];
    for (const reference of ctx.references) {
      if (reference.use === 'input') continue;
      const control = ctx.controls.get(reference.controlId);
      if (!control || control.kind !== 'switch') continue;
      const n = control.positions;
      if (reference.use === 'rates') {
        const count = reference.positions.length;
        if (count === n) continue;
        const owner = capitalize(referenceOwner(setup, reference));
        const hint = `Give exactly ${n} weights, one per position of ${control.id}.`;
        results.push(
          count > n
            ? {
                message: `${owner} gives ${count} rates weights, but ${control.id} has only ${n} positions (${positionWords(n)}); weight ${n + 1} is never used.`,
                hint,
                ...positionRef(setup, reference, n),
              }
            : {
                message: `${owner} gives ${count} rates weights, but ${control.id} has ${n} positions; at position ${n - 1} the mix falls back to its weight.`,
                hint,
                ...ref.mix(setup, reference.index, 'rates', 'weights'),
              },
        );
        continue;
      }
      reference.positions.forEach((position, i) => {
        if (position < n) return;
        results.push({
          message: `${capitalize(referenceOwner(setup, reference))} uses position ${position} of ${control.id}, which has only ${positionWords(n)}, so that setting can never happen.`,
          hint: `Use a position from 0 to ${n - 1}.`,
          ...positionRef(setup, reference, i),
        });
      });
    }
    return results;
  },
};
