import type { Check, CheckResult } from './check';
import { ref } from './refs';

export const ENDSTOP_MARGIN_US = 25;
const ROLES = new Set(['aileron', 'elevator', 'rudder', 'steering', 'aux']);

export const failsafeEndstop: Check = {
  id: 'failsafe-endstop',
  severity: 'warning',
  description: `A pin carrying an aileron, elevator, rudder, steering or aux channel fails safe within ${ENDSTOP_MARGIN_US} microseconds of its travel's end or beyond it.`,
  check(setup, ctx) {
    const results: CheckResult[] = [];
    setup.receivers.forEach((receiver, ri) =>
      receiver.map.forEach((entry, pi) => {
        if (typeof entry.failsafe !== 'number') return;
        const failsafe = entry.failsafe;
        const channel = ctx.planned.get(entry.ch)?.find((p) => ROLES.has(p.channel.role))?.channel;
        if (!channel) return;
        const low = Math.min(channel.travel.low_us, channel.travel.high_us);
        const high = Math.max(channel.travel.low_us, channel.travel.high_us);
        const nearLow = failsafe <= low + ENDSTOP_MARGIN_US;
        if (!nearLow && failsafe < high - ENDSTOP_MARGIN_US) return;
        const end = nearLow ? low : high;
        results.push({
          message: `Pin ${entry.pin} of receiver ${receiver.id} carries ${channel.function} (channel ${entry.ch}, ${channel.role === 'aileron' || channel.role === 'elevator' || channel.role === 'aux' ? 'an' : 'a'} ${channel.role}) but fails safe to ${failsafe} µs, at or beyond the end of its travel (${end} µs); on signal loss it would drive the surface to its stop. This is often a throttle failsafe left behind after a remap.`,
          hint: `Set the failsafe near centre (${channel.travel.center_us} µs) or to hold.`,
          ...ref.pin(setup, ri, pi, 'failsafe'),
        });
      }),
    );
    return results;
  },
};
