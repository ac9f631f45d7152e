import type { Failsafe } from '../format/schema';
import type { Check, CheckResult } from './check';
import { capitalize, channelName } from './context';
import { ref } from './refs';

// Two servos on one surface fed by two receivers fight when only one of them goes to
// failsafe, unless both fail safe to the same position: common practice, no published
// source (docs/sources.md, second edition). 10 µs is about one degree of a standard servo
// ([servo-datasheet]: 400 µs for 40 degrees).
export const MISMATCH_TOLERANCE_US = 10;

function describe(failsafe: Failsafe): string {
  if (failsafe === undefined) return 'the receiver default';
  if (typeof failsafe === 'number') return `${failsafe} µs`;
  return failsafe;
}

function agree(a: Failsafe, b: Failsafe): boolean {
  if (typeof a === 'number' && typeof b === 'number') return Math.abs(a - b) <= MISMATCH_TOLERANCE_US;
  return a === b;
}

export const failsafeMismatch: Check = {
  id: 'failsafe-mismatch',
  severity: 'warning',
  description: `One channel on pins of two or more receivers with failsafes that differ by more than ${MISMATCH_TOLERANCE_US} microseconds, or hold on one and a pulse on another: when one unit loses the link the servos fight.`,
  check(setup, ctx) {
    const results: CheckResult[] = [];
    for (const [ch, carriers] of ctx.carriers) {
      const first = carriers[0];
      // Each further receiver is compared with the first receiver's pin; one finding per channel.
      const other = carriers.find(
        (carrier) => carrier.receiver !== first.receiver && !agree(first.entry.failsafe, carrier.entry.failsafe),
      );
      if (!other) continue;
      results.push({
        message: `${capitalize(channelName(ctx, ch))} is on pin ${first.entry.pin} of receiver ${first.receiver.id} failing safe to ${describe(first.entry.failsafe)} and on pin ${other.entry.pin} of receiver ${other.receiver.id} failing safe to ${describe(other.entry.failsafe)}: when only one of them loses the link, servos on one surface pull against each other.`,
        hint: 'Give every pin that carries this channel the same failsafe pulse.',
        ...ref.pin(setup, other.receiverIndex, other.entryIndex, 'failsafe'),
      });
    }
    return results;
  },
};
