import type { Check } from './check';
import { ref } from './refs';

export const pinBeyondOutputs: Check = {
  id: 'pin-beyond-outputs',
  severity: 'error',
  description: "A map entry's pin is above the receiver's number of outputs.",
  check(setup) {
    return setup.receivers.flatMap((receiver, ri) =>
      receiver.map.flatMap((entry, pi) =>
        entry.pin > receiver.outputs
          ? [
              {
                message: `Receiver ${receiver.id} has ${receiver.outputs} outputs, but its map uses pin ${entry.pin} (channel ${entry.ch}), which it does not have.`,
                hint: `Use a pin from 1 to ${receiver.outputs}, or correct the receiver's outputs.`,
                ...ref.pin(setup, ri, pi, 'pin'),
              },
            ]
          : [],
      ),
    );
  },
};
