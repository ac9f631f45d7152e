import type { Check } from './check';
import { ref } from './refs';

export const powerDoubleSupply: Check = {
  id: 'power-double-supply',
  severity: 'warning',
  description:
    "receiver_supply is both: a separate pack in parallel with an ESC's built-in regulator can back-feed and damage the ESC.",
  check(setup) {
    if (setup.power?.receiver_supply !== 'both') return [];
    return [
      {
        message:
          "The receivers are powered both by the ESC's regulator and by a separate pack; the pack can back-feed the regulator and damage the ESC.",
        hint: "Use one supply: with a separate pack, disconnect the ESC's red (positive) lead from the receiver.",
        ...ref.root('power', 'receiver_supply'),
      },
    ];
  },
};
