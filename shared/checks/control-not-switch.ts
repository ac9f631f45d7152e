import type { Check } from './check';
import { capitalize } from './context';
import { referenceOwner, referenceRef, USE_WORDS } from './control-references';

export const controlNotSwitch: Check = {
  id: 'control-not-switch',
  severity: 'error',
  description: 'Rates, active or cut names a control that is not a switch.',
  check(setup, ctx) {
    const switches = setup.controls.filter((control) => control.kind === 'switch').map((control) => control.id);
    return ctx.references.flatMap((reference) => {
      const control = ctx.controls.get(reference.controlId);
      if (reference.use === 'input' || !control || control.kind === 'switch') return [];
      return [
        {
          message: `${capitalize(referenceOwner(setup, reference))} uses ${control.id} ${USE_WORDS[reference.use]}, but ${control.id} is ${control.kind === 'axis' ? 'an' : 'a'} ${control.kind}, which has no positions.`,
          hint:
            switches.length > 0
              ? `Use a switch (${switches.join(', ')}).`
              : 'Add a switch to controls and use it here.',
          ...referenceRef(setup, reference),
        },
      ];
    });
  },
};
