import { idlePulse } from '../evaluate/evaluate';
import type { Check, CheckResult } from './check';
import { ref } from './refs';

export const THROTTLE_FAILSAFE_TOLERANCE_US = 50;

export const failsafeThrottle: Check = {
  id: 'failsafe-throttle',
  severity: 'error',
  description: `A pin carrying a throttle channel fails safe to hold, or to a pulse more than ${THROTTLE_FAILSAFE_TOLERANCE_US} microseconds from idle toward full power.`,
  check(setup, ctx) {
    const results: CheckResult[] = [];
    setup.receivers.forEach((receiver, ri) =>
      receiver.map.forEach((entry, pi) => {
        const throttle = ctx.planned.get(entry.ch)?.find((p) => p.channel.role === 'throttle')?.channel;
        if (!throttle) return;
        const where = `Pin ${entry.pin} of receiver ${receiver.id} carries the throttle (channel ${entry.ch}, ${throttle.function})`;
        if (entry.failsafe === 'hold') {
          results.push({
            message: `${where} and fails safe to hold, so on signal loss the motor keeps running at its last setting.`,
            hint: `Set the failsafe to the idle pulse, ${idlePulse(throttle.travel)} us, or to off.`,
            ...ref.pin(setup, ri, pi, 'failsafe'),
          });
          return;
        }
        if (typeof entry.failsafe !== 'number') return;
        const idle = idlePulse(throttle.travel);
        const towardPower = throttle.travel.reverse ? idle - entry.failsafe : entry.failsafe - idle;
        if (towardPower <= THROTTLE_FAILSAFE_TOLERANCE_US) return;
        results.push({
          message: `${where} and fails safe to ${entry.failsafe} us, ${towardPower} us above idle (${idle} us) toward full power, so on signal loss the motor keeps running.`,
          hint: `Set the failsafe to the idle pulse, ${idle} us.`,
          ...ref.pin(setup, ri, pi, 'failsafe'),
        });
      }),
    );
    return results;
  },
};
