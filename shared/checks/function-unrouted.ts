import type { Check } from './check';
import { ref } from './refs';

export const functionUnrouted: Check = {
  id: 'function-unrouted',
  severity: 'error',
  description: 'A channel-plan entry whose channel no receiver pin carries.',
  check(setup, ctx) {
    return setup.channels.flatMap((channel, i) =>
      ctx.carriers.has(channel.ch)
        ? []
        : [
            {
              message: `Channel ${channel.ch} (${channel.function}) is not on any receiver pin, so whatever it drives is not connected.`,
              hint: `Map a free pin of a receiver to channel ${channel.ch}.`,
              ...ref.channel(setup, i),
            },
          ],
    );
  },
};
