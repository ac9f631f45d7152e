import type { Check } from './check';
import { ref } from './refs';

export const failsafeUnset: Check = {
  id: 'failsafe-unset',
  severity: 'warning',
  description: 'A map entry without a failsafe: the pin does whatever the receiver does by default on signal loss.',
  check(setup) {
    return setup.receivers.flatMap((receiver, ri) =>
      receiver.map.flatMap((entry, pi) =>
        entry.failsafe !== undefined
          ? []
          : [
              {
                message: `Pin ${entry.pin} of receiver ${receiver.id} (channel ${entry.ch}) has no failsafe, so on signal loss it does whatever the receiver does by default.`,
                hint: 'Set failsafe to a pulse in microseconds, hold or off, and set the same on the receiver.',
                ...ref.pin(setup, ri, pi),
              },
            ],
      ),
    );
  },
};
