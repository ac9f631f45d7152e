import type { Check } from './check';
import { ref } from './refs';

export const channelShared: Check = {
  id: 'channel-shared',
  severity: 'error',
  description: 'Two channel-plan entries on the same channel: two functions would move together.',
  check(setup, ctx) {
    return [...ctx.planned.values()].flatMap((entries) =>
      entries.slice(1).map(({ channel, index }) => ({
        message: `Channel ${channel.ch} carries both ${entries[0].channel.function} and ${channel.function}, so they would always move together.`,
        hint: `Move ${channel.function} to a free channel.`,
        ...ref.channel(setup, index, 'ch'),
      })),
    );
  },
};
