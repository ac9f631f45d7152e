import type { Check } from './check';
import { ref } from './refs';

export const pinUndriven: Check = {
  id: 'pin-undriven',
  severity: 'warning',
  description: 'A receiver pin carries a channel that has no channel-plan entry.',
  check(setup, ctx) {
    return setup.receivers.flatMap((receiver, ri) =>
      receiver.map.flatMap((entry, pi) =>
        ctx.planned.has(entry.ch)
          ? []
          : [
              {
                message: `Pin ${entry.pin} of receiver ${receiver.id} carries channel ${entry.ch}, which the channel plan does not define, so nobody knows what it drives.`,
                hint: `Add channel ${entry.ch} to the channel plan, or remove the pin from the map.`,
                ...ref.pin(setup, ri, pi, 'ch'),
              },
            ],
      ),
    );
  },
};
