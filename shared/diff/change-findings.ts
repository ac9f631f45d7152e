import type { Severity } from '../findings';
import type { Setup, Travel } from '../format/schema';

/** A mistake that exists only between two revisions (docs/format.md, "Checks across two revisions"). */
export interface ChangeFinding {
  rule: string;
  severity: Severity;
  /** Semantic path in the new revision. */
  path: string;
  message: string;
  hint: string;
  /** Set when a club rule changed the check's severity: "club rule: warning raised to error". */
  club_rule?: string;
}

/**
 * The checks across two revisions, with their own severities: a club's rules may raise
 * or lower them like any check of one revision (docs/format.md, "Club rules").
 */
export const CHANGE_CHECKS: readonly { id: string; severity: Severity }[] = [
  { id: 'failsafe-meaning-changed', severity: 'warning' },
];

/** The channel value in percent that a pulse stands for through a travel (rule 5 inverted, unclamped). */
function valueAt(travel: Travel, pulse: number): number {
  const half = pulse >= travel.center_us ? travel.high_us - travel.center_us : travel.center_us - travel.low_us;
  const v = half === 0 ? 0 : ((pulse - travel.center_us) / half) * 100;
  return travel.reverse ? -v : v;
}

/** Below this many percent of travel the surface is taken to be in the same place. */
const SAME_PLACE_PERCENT = 1;

function travelChanges(before: Travel, after: Travel): string[] {
  const changes: string[] = [];
  if (before.reverse !== after.reverse) changes.push(after.reverse ? 'reversed' : 'no longer reversed');
  for (const key of ['center_us', 'low_us', 'high_us'] as const)
    if (before[key] !== after[key]) changes.push(`${key} ${before[key]} -> ${after[key]}`);
  return changes;
}

/**
 * `failsafe-meaning-changed` (warning): a channel's travel (reverse, centre or ends)
 * changed while a pin that carries it on both sides kept the same failsafe number. The
 * receiver stores the pulse, not the position, so the same number now puts the surface
 * somewhere else: a reversed channel's 1100 µs was near one end and is now near the
 * other. Channels are matched by `ch`, pins by receiver id and pin; a pin's failsafe
 * counts as kept when it is the same number on both sides. A pulse that stands for
 * the same channel value (within 1 % of travel) through both travels, such as the
 * centre pulse of a channel that was only reversed, keeps its meaning and is not
 * reported.
 */
export function failsafeMeaningChanged(before: Setup, after: Setup): ChangeFinding[] {
  const travelBefore = new Map<number, Travel>();
  for (const channel of before.channels)
    if (!travelBefore.has(channel.ch)) travelBefore.set(channel.ch, channel.travel);
  const seen = new Set<number>();
  const findings: ChangeFinding[] = [];
  for (const channel of after.channels) {
    if (seen.has(channel.ch)) continue;
    seen.add(channel.ch);
    const was = travelBefore.get(channel.ch);
    if (!was) continue;
    const changes = travelChanges(was, channel.travel);
    if (changes.length === 0) continue;
    for (const receiver of after.receivers) {
      const old = before.receivers.find((r) => r.id === receiver.id);
      for (const entry of receiver.map) {
        if (entry.ch !== channel.ch || typeof entry.failsafe !== 'number') continue;
        const previous = old?.map.find((e) => e.pin === entry.pin);
        if (!previous || previous.ch !== entry.ch || previous.failsafe !== entry.failsafe) continue;
        // A centre pulse stays the centre when only `reverse` changes: no new meaning.
        const then = valueAt(was, entry.failsafe);
        const now = valueAt(channel.travel, entry.failsafe);
        if (Math.abs(then - now) < SAME_PLACE_PERCENT) continue;
        findings.push({
          rule: 'failsafe-meaning-changed',
          severity: 'warning',
          path: `receivers[id=${receiver.id}].map[pin=${entry.pin}].failsafe`,
          message: `Channel ${channel.ch} (${channel.function}) changed its travel (${changes.join(', ')}), but pin ${entry.pin} of receiver ${receiver.id} still fails safe to ${entry.failsafe} µs: the same pulse meant ${Math.round(then)} % of travel and now means ${Math.round(now)} %.`,
          hint: `Work out where ${channel.function} should go on signal loss with the new travel, set that pulse as the failsafe, and check it on the bench with the link off.`,
        });
      }
    }
  }
  return findings;
}

/** Every check across two revisions. */
export function changeFindings(before: Setup, after: Setup): ChangeFinding[] {
  return failsafeMeaningChanged(before, after);
}
