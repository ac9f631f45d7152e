import type { Check } from './check';
import { ref } from './refs';

export const channelUndriven: Check = {
  id: 'channel-undriven',
  severity: 'warning',
  description: 'A planned channel that no mix feeds and no cut sets: it stays at centre.',
  check(setup, ctx) {
    return setup.channels.flatMap((channel, i) =>
      ctx.mixesByTarget.has(channel.ch) || channel.cut
        ? []
        : [
            {
              message: `Channel ${channel.ch} (${channel.function}) has no mix feeding it and no cut, so it stays at centre.`,
              hint: `Add a mix from a control to channel ${channel.ch}.`,
              ...ref.channel(setup, i),
            },
          ],
    );
  },
};
