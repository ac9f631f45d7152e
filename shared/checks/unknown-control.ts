import type { Check } from './check';
import { capitalize } from './context';
import { controlReferences, USE_WORDS } from './control-references';

export const unknownControl: Check = {
  id: 'unknown-control',
  severity: 'error',
  description: 'A mix, rates, active or cut names a control that does not exist.',
  check(setup, ctx) {
    const known = setup.controls.map((control) => control.id);
    return controlReferences(setup)
      .filter((reference) => !ctx.controls.has(reference.controlId))
      .map((reference) => ({
        message: `${capitalize(reference.owner)} uses the control ${reference.controlId} ${USE_WORDS[reference.use]}, but there is no control with that id.`,
        hint: `Use one of the controls (${known.join(', ')}), or add ${reference.controlId} to controls.`,
        ...reference.ref,
      }));
  },
};

