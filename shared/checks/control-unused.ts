import type { Check } from './check';
import { ref } from './refs';

export const controlUnused: Check = {
  id: 'control-unused',
  severity: 'info',
  description: 'A control that nothing refers to.',
  check(setup, ctx) {
    const used = new Set(ctx.references.map((reference) => reference.controlId));
    return setup.controls.flatMap((control, i) =>
      used.has(control.id)
        ? []
        : [
            {
              message: `The control ${control.id} is not used by any mix, rates, active or cut.`,
              hint: 'Use it in a mix, or remove it from controls.',
              ...ref.control(setup, i),
            },
          ],
    );
  },
};
