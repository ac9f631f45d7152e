import type { Check } from './check';
import { capitalize } from './context';
import { referenceOwner, referenceRef, USE_WORDS } from './control-references';

export const unknownControl: Check = {
  id: 'unknown-control',
  severity: 'error',
  description: 'A mix, rates, active or cut names a control that does not exist.',
  check(setup, ctx) {
    const known = setup.controls.map((control) => control.id);
    return ctx.references
      .filter((reference) => !ctx.controls.has(reference.controlId))
      .map((reference) => ({
        message: `${capitalize(referenceOwner(setup, reference))} uses the control ${reference.controlId} ${USE_WORDS[reference.use]}, but there is no control with that id.`,
        hint: `Use one of the controls (${known.join(', ')}), or add ${reference.controlId} to controls.`,
        ...referenceRef(setup, reference),
      }));
  },
};
