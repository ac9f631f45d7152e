import type { Check } from './check';
import { ref } from './refs';

export const motorWithoutCut: Check = {
  id: 'motor-without-cut',
  severity: 'warning',
  description: 'A throttle channel without a cut (no arm switch).',
  check(setup) {
    return setup.channels.flatMap((channel, i) =>
      channel.role !== 'throttle' || channel.cut
        ? []
        : [
            {
              message: `Channel ${channel.ch} (${channel.function}) is a throttle without a cut, so a bumped stick can start the motor on the bench.`,
              hint: 'Add a cut: { control, position, value: -100 } on an arm switch.',
              ...ref.channel(setup, i),
            },
          ],
    );
  },
};
