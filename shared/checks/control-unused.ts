import type { Check } from './check';
import { controlReferences } from './control-references';
import { ref } from './refs';

export const controlUnused: Check = {
  id: 'control-unused',
  severity: 'info',
  description: 'A control that nothing refers to.',
  check(setup) {
    const used = new Set(controlReferences(setup).map((reference) => reference.controlId));
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
