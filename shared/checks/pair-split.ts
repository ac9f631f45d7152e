import type { Check, CheckResult } from './check';
import type { CheckContext, PlannedChannel } from './context';
import { listNames } from './context';
import { ref } from './refs';

function receiversOf(ctx: CheckContext, ch: number): string[] {
  return [...new Set((ctx.carriers.get(ch) ?? []).map((carrier) => carrier.receiver.id))].sort();
}

export const pairSplit: Check = {
  id: 'pair-split',
  severity: 'warning',
  description:
    'A left/right pair of one role carried by different receivers: if one receiver loses the link, the pair moves apart.',
  check(setup, ctx) {
    const sides = new Map<string, { left: PlannedChannel[]; right: PlannedChannel[] }>();
    setup.channels.forEach((channel, index) => {
      if (!channel.side) return;
      const pair = sides.get(channel.role) ?? { left: [], right: [] };
      pair[channel.side].push({ channel, index });
      sides.set(channel.role, pair);
    });
    const results: CheckResult[] = [];
    for (const [role, pair] of sides) {
      // Compare every left with every right and report each role once, at the first split.
      split: for (const left of pair.left) {
        const leftOn = receiversOf(ctx, left.channel.ch);
        if (leftOn.length === 0) continue;
        for (const right of pair.right) {
          const rightOn = receiversOf(ctx, right.channel.ch);
          if (rightOn.length === 0 || leftOn.join() === rightOn.join()) continue;
          results.push({
            message: `${left.channel.function} (channel ${left.channel.ch}) is on receiver ${listNames(leftOn)} but ${right.channel.function} (channel ${right.channel.ch}) is on receiver ${listNames(rightOn)}: if one receiver loses the link, the ${role} pair moves apart.`,
            hint: 'Carry both sides of the pair on the same receiver.',
            ...ref.channel(setup, right.index),
          });
          break split;
        }
      }
    }
    return results;
  },
};
