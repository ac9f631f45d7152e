import { pulseFor } from '../evaluate/evaluate';
import { stopPulse, stopValue, throttleStop } from '../evaluate/throttle-stop';
import type { Check } from './check';
import { ref } from './refs';

// A speed controller has a small dead band at its stop; 10 µs is common practice, no
// published source.
export const CUT_TOLERANCE_US = 10;

export const cutNotAtStop: Check = {
  id: 'cut-not-at-stop',
  severity: 'warning',
  description: `A throttle channel's cut value does not put it within ${CUT_TOLERANCE_US} microseconds of its stop pulse: the arm switch does not stop the motor.`,
  check(setup) {
    return setup.channels.flatMap((channel, i) => {
      if (channel.role !== 'throttle' || !channel.cut) return [];
      const stopUs = stopPulse(channel, setup);
      const cutUs = pulseFor(channel.travel, channel.cut.value);
      if (Math.abs(cutUs - stopUs) <= CUT_TOLERANCE_US) return [];
      return [
        {
          message: `Channel ${channel.ch} (${channel.function}) is cut to ${channel.cut.value} %, which sends ${cutUs} µs, but the motor stops at ${stopUs} µs: with the arm switch at its safe position the motor can still run.`,
          hint: `Set the cut value to ${stopValue(throttleStop(channel, setup))} % so that it sends the stop pulse.`,
          ...ref.channel(setup, i, 'cut', 'value'),
        },
      ];
    });
  },
};
