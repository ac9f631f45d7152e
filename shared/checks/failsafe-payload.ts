import { evaluate } from '../evaluate/evaluate';
import { restPositions } from '../evaluate/rest';
import type { Check, CheckResult } from './check';
import { ref } from './refs';

// A release that opens on signal loss drops its load on whatever is below: common
// practice, some event rules say so (docs/sources.md, second edition). 25 µs is the same
// margin as failsafe-endstop's, common practice, no published source.
export const PAYLOAD_MARGIN_US = 25;

export const failsafePayload: Check = {
  id: 'failsafe-payload',
  severity: 'warning',
  description: `A payload pin whose failsafe is neither hold nor within ${PAYLOAD_MARGIN_US} microseconds of its at-rest pulse: losing the link releases the load.`,
  check(setup, ctx) {
    const results: CheckResult[] = [];
    let rest: Map<string, number | null> | null = null;
    setup.receivers.forEach((receiver, ri) =>
      receiver.map.forEach((entry, pi) => {
        // An unset failsafe is failsafe-unset's warning already.
        if (entry.failsafe === undefined || entry.failsafe === 'hold') return;
        const payload = ctx.planned.get(entry.ch)?.find((p) => p.channel.role === 'payload')?.channel;
        if (!payload) return;
        rest ??= restPulses(setup);
        const restUs = rest.get(`${receiver.id}\u0000${entry.pin}`);
        if (typeof restUs !== 'number') return;
        if (typeof entry.failsafe === 'number' && Math.abs(entry.failsafe - restUs) <= PAYLOAD_MARGIN_US) return;
        const what = entry.failsafe === 'off' ? 'stops its pulses (off)' : `fails safe to ${entry.failsafe} µs`;
        results.push({
          message: `Pin ${entry.pin} of receiver ${receiver.id} carries the payload ${payload.function} (channel ${entry.ch}) and ${what}, not its at-rest pulse of ${restUs} µs: on signal loss the release may open and drop the load.`,
          hint: `Set the failsafe to hold, or to the at-rest pulse, ${restUs} µs.`,
          ...ref.pin(setup, ri, pi, 'failsafe'),
        });
      }),
    );
    return results;
  },
};

function restPulses(setup: Parameters<typeof evaluate>[0]): Map<string, number | null> {
  const pulses = new Map<string, number | null>();
  for (const receiver of evaluate(setup, restPositions(setup)).receivers)
    for (const pin of receiver.pins) {
      const key = `${receiver.id}\u0000${pin.pin}`;
      if (!pulses.has(key)) pulses.set(key, pin.pulse_us);
    }
  return pulses;
}
