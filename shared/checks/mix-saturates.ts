import { channelExtremes, type Extreme } from '../evaluate/channel-extremes';
import type { Check, CheckResult } from './check';
import { channelName, listNames } from './context';
import { ref } from './refs';

const LIMIT = 100;
const EPSILON = 1e-9;

function percent(value: number): string {
  const rounded = Math.round(value * 10) / 10;
  return `${rounded > 0 ? '+' : ''}${rounded === 0 ? 0 : rounded} %`;
}

function describeSetting(extreme: Extreme, order: readonly string[], switches: ReadonlySet<string>): string {
  const parts = order
    .filter((id) => id in extreme.setting)
    .map((id) =>
      switches.has(id) ? `${id} at position ${extreme.setting[id]}` : `${id} at ${percent(extreme.setting[id])}`,
    );
  return parts.length > 0 ? listNames(parts) : 'any control positions';
}

export const mixSaturates: Check = {
  id: 'mix-saturates',
  severity: 'warning',
  description:
    'Some combination of control positions drives a channel past +-100 % before clamping; the message names the worst one.',
  check(setup, ctx) {
    const results: CheckResult[] = [];
    const order = setup.controls.map((control) => control.id);
    for (const [ch, entries] of ctx.mixesByTarget) {
      const extremes = channelExtremes(
        entries.map((entry) => entry.mix),
        ctx.controls,
      );
      const over = extremes.max.value - LIMIT;
      const under = -LIMIT - extremes.min.value;
      if (over <= EPSILON && under <= EPSILON) continue;
      const worst = over >= under ? extremes.max : extremes.min;
      const name = channelName(ctx, ch);
      const mixIds = entries.map((entry) => entry.mix.id);
      const planned = ctx.planned.get(ch);
      const where = planned ? ref.channel(setup, planned[0].index) : ref.mix(setup, entries[0].index);
      const message = extremes.exact
        ? `The mixes on ${name} add up to ${percent(worst.value)} with ${describeSetting(worst, order, new Set(extremes.switches))}, past the ${LIMIT} % the channel can move; beyond that the servo does not follow.`
        : `The mixes on ${name} depend on ${extremes.switches.length} switches together, too many to try every combination; at their strongest they could add up to ${percent(worst.value)}, past the ${LIMIT} % the channel can move.`;
      results.push({
        message,
        hint: `Lower the weights or offsets of ${listNames(mixIds)}, or let them count only in some switch positions (active), so that they stay within ${LIMIT} %.`,
        ...where,
      });
    }
    return results;
  },
};
