import type { Check } from './check';
import { ref } from './refs';

export const travelOrder: Check = {
  id: 'travel-order',
  severity: 'error',
  description: 'Travel is not low_us < center_us < high_us.',
  check(setup) {
    return setup.channels.flatMap((channel, i) => {
      const { low_us: low, center_us: center, high_us: high } = channel.travel;
      if (low < center && center < high) return [];
      return [
        {
          message: `Channel ${channel.ch} (${channel.function}) has travel ${low}/${center}/${high} µs (low/centre/high), but low must be below centre and centre below high.`,
          hint: 'Put the pulses in order; to make the servo move the other way, set reverse: true instead of swapping them.',
          ...ref.channel(setup, i, 'travel'),
        },
      ];
    });
  },
};
