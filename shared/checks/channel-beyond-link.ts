import type { Check, CheckResult } from './check';
import { ref } from './refs';

export const channelBeyondLink: Check = {
  id: 'channel-beyond-link',
  severity: 'error',
  description: 'A channel-plan entry, mix target or receiver map entry uses a channel above link.channels.',
  check(setup) {
    const limit = setup.link.channels;
    const hint = `Use a channel from 1 to ${limit}, or raise link.channels if the link's mode carries more.`;
    const results: CheckResult[] = [];
    setup.channels.forEach((channel, i) => {
      if (channel.ch > limit) {
        results.push({
          message: `Channel ${channel.ch} (${channel.function}) is above the ${limit} channels the link carries, so it does nothing at the receiver.`,
          hint,
          ...ref.channel(setup, i, 'ch'),
        });
      }
    });
    setup.mixes.forEach((mix, i) => {
      if (mix.to > limit) {
        results.push({
          message: `Mix ${mix.id} feeds channel ${mix.to}, above the ${limit} channels the link carries.`,
          hint,
          ...ref.mix(setup, i, 'to'),
        });
      }
    });
    setup.receivers.forEach((receiver, ri) =>
      receiver.map.forEach((entry, pi) => {
        if (entry.ch > limit) {
          results.push({
            message: `Pin ${entry.pin} of receiver ${receiver.id} carries channel ${entry.ch}, above the ${limit} channels the link carries; the pin gets no signal.`,
            hint,
            ...ref.pin(setup, ri, pi, 'ch'),
          });
        }
      }),
    );
    return results;
  },
};
