import { motorOf, stopPulse, throttleStop } from '../evaluate/throttle-stop';
import type { Check, CheckResult } from './check';
import { ref } from './refs';

// [cap-658]: on loss of signal the throttle must go to closed or idle. The 50 µs
// allowance above the stop is common practice, no published source (a little idle
// trim on a fuel engine, or a speed controller's dead band).
export const THROTTLE_FAILSAFE_TOLERANCE_US = 50;

export const failsafeThrottle: Check = {
  id: 'failsafe-throttle',
  severity: 'error',
  description: `A pin carrying a throttle channel fails safe to hold, to a pulse more than ${THROTTLE_FAILSAFE_TOLERANCE_US} microseconds from the stop pulse toward power (either side of centre for a centre stop), or to off on a fuel or turbine engine.`,
  check(setup, ctx) {
    const results: CheckResult[] = [];
    const motor = motorOf(setup);
    setup.receivers.forEach((receiver, ri) =>
      receiver.map.forEach((entry, pi) => {
        const throttle = ctx.planned.get(entry.ch)?.find((p) => p.channel.role === 'throttle')?.channel;
        if (!throttle) return;
        const stop = throttleStop(throttle, setup);
        const stopUs = stopPulse(throttle, setup);
        const where = `Pin ${entry.pin} of receiver ${receiver.id} carries the throttle (channel ${entry.ch}, ${throttle.function})`;
        const fix = `Set the failsafe to the stop pulse, ${stopUs} µs`;
        if (entry.failsafe === 'hold') {
          results.push({
            message: `${where} and fails safe to hold, so on signal loss the motor keeps running at its last setting.`,
            hint: `${fix}${motor === 'electric' ? ', or to off if the speed controller stops without pulses' : ''}.`,
            ...ref.pin(setup, ri, pi, 'failsafe'),
          });
          return;
        }
        if (entry.failsafe === 'off') {
          if (motor !== 'fuel' && motor !== 'turbine') return;
          results.push({
            message: `${where} and fails safe to off, but the model has a ${motor} engine: its throttle servo keeps its position when the pulses stop, so off acts like hold and the engine keeps running.`,
            hint: `${fix}.`,
            ...ref.pin(setup, ri, pi, 'failsafe'),
          });
          return;
        }
        if (typeof entry.failsafe !== 'number') return;
        if (stop === 'center') {
          // A forward/reverse controller: both directions from centre are power.
          const away = Math.abs(entry.failsafe - stopUs);
          if (away <= THROTTLE_FAILSAFE_TOLERANCE_US) return;
          const direction = entry.failsafe > stopUs ? 'above' : 'below';
          results.push({
            message: `${where} and fails safe to ${entry.failsafe} µs, ${away} µs ${direction} the centre stop (${stopUs} µs); a forward/reverse speed controller runs the motor on either side of centre, so on signal loss the model drives off.`,
            hint: `${fix} (the centre).`,
            ...ref.pin(setup, ri, pi, 'failsafe'),
          });
          return;
        }
        const towardPower = throttle.travel.reverse ? stopUs - entry.failsafe : entry.failsafe - stopUs;
        if (towardPower <= THROTTLE_FAILSAFE_TOLERANCE_US) return;
        results.push({
          message: `${where} and fails safe to ${entry.failsafe} µs, ${towardPower} µs from the stop (${stopUs} µs) toward full power, so on signal loss the motor keeps running.`,
          hint: `${fix}.`,
          ...ref.pin(setup, ri, pi, 'failsafe'),
        });
      }),
    );
    return results;
  },
};
