import { motorOf } from '../evaluate/throttle-stop';
import type { Check, CheckResult } from './check';
import { ref } from './refs';

// Many electric speed controllers stop or disarm when pulses stop, but not all: common
// practice, no published source (docs/sources.md, second edition). Fuel and turbine
// engines are failsafe-throttle's errors instead.
export const failsafeNoPulses: Check = {
  id: 'failsafe-no-pulses',
  severity: 'warning',
  description:
    'A throttle pin of an electric model fails safe to off: many speed controllers stop without pulses, some do not.',
  check(setup, ctx) {
    if (motorOf(setup) !== 'electric') return [];
    const results: CheckResult[] = [];
    setup.receivers.forEach((receiver, ri) =>
      receiver.map.forEach((entry, pi) => {
        if (entry.failsafe !== 'off') return;
        const throttle = ctx.planned.get(entry.ch)?.find((p) => p.channel.role === 'throttle')?.channel;
        if (!throttle) return;
        results.push({
          message: `Pin ${entry.pin} of receiver ${receiver.id} carries the throttle (channel ${entry.ch}, ${throttle.function}) and fails safe to off: many speed controllers stop when the pulses stop, but some keep the last setting.`,
          hint: 'With the propeller off, switch the transmitter off and check that the motor stops; or fail safe to the stop pulse instead.',
          ...ref.pin(setup, ri, pi, 'failsafe'),
        });
      }),
    );
    return results;
  },
};
