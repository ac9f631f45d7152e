import type { Check } from './check';
import { ref } from './refs';

export const mixUnplannedTarget: Check = {
  id: 'mix-unplanned-target',
  severity: 'warning',
  description: 'A mix feeds a channel that has no channel-plan entry.',
  check(setup, ctx) {
    return setup.mixes.flatMap((mix, i) =>
      ctx.planned.has(mix.to)
        ? []
        : [
            {
              message: `Mix ${mix.id} feeds channel ${mix.to}, which the channel plan does not define.`,
              hint: `Add channel ${mix.to} to the channel plan, or point the mix at a planned channel.`,
              ...ref.mix(setup, i, 'to'),
            },
          ],
    );
  },
};
