import type { Check, CheckResult } from './check';
import { ref } from './refs';

// Most servos respond to pulses of roughly 700 to 2300 microseconds; outside that a
// servo may strain against its stop or ignore the signal.
export const PULSE_MIN_US = 700;
export const PULSE_MAX_US = 2300;

const outside = (pulse: number) => pulse < PULSE_MIN_US || pulse > PULSE_MAX_US;
const HINT = `Keep pulses between ${PULSE_MIN_US} and ${PULSE_MAX_US} microseconds.`;

export const pulseOutOfRange: Check = {
  id: 'pulse-out-of-range',
  severity: 'error',
  description: `A travel or failsafe pulse outside ${PULSE_MIN_US}-${PULSE_MAX_US} microseconds.`,
  check(setup) {
    const results: CheckResult[] = [];
    setup.channels.forEach((channel, i) => {
      for (const key of ['low_us', 'center_us', 'high_us'] as const) {
        const pulse = channel.travel[key];
        if (!outside(pulse)) continue;
        results.push({
          message: `Channel ${channel.ch} (${channel.function}) has ${key} ${pulse} µs, outside the ${PULSE_MIN_US}-${PULSE_MAX_US} µs a servo can follow.`,
          hint: HINT,
          ...ref.channel(setup, i, 'travel', key),
        });
      }
    });
    setup.receivers.forEach((receiver, ri) =>
      receiver.map.forEach((entry, pi) => {
        if (typeof entry.failsafe !== 'number' || !outside(entry.failsafe)) return;
        results.push({
          message: `Pin ${entry.pin} of receiver ${receiver.id} fails safe to ${entry.failsafe} µs, outside the ${PULSE_MIN_US}-${PULSE_MAX_US} µs a servo can follow.`,
          hint: HINT,
          ...ref.pin(setup, ri, pi, 'failsafe'),
        });
      }),
    );
    return results;
  },
};
