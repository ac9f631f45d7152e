import type { Mix } from '../format/schema';
import type { Check, CheckResult } from './check';
import { ref } from './refs';

const ROLES = new Set(['aileron', 'elevator', 'rudder']);
/** Channels whose mixes depend on more active switches than this are not enumerated. */
const SWITCH_LIMIT = 6;

function signOf(weight: number): number {
  return Math.sign(weight);
}

export const primaryDisabledBySwitch: Check = {
  id: 'primary-disabled-by-switch',
  severity: 'warning',
  description:
    'Some switch position leaves an aileron, elevator or rudder channel with no active mix, a zero rates weight, or a weight of the opposite sign to the other positions.',
  check(setup, ctx) {
    const results: CheckResult[] = [];
    setup.channels.forEach((channel, ci) => {
      if (!ROLES.has(channel.role)) return;
      // The stick mixes: those from an axis, knob or slider. A switch mix (a trim step)
      // gives the pilot no control of the surface.
      const sticks = (ctx.mixesByTarget.get(channel.ch) ?? []).filter(({ mix }) => {
        const from = ctx.controls.get(mix.from);
        return from !== undefined && from.kind !== 'switch';
      });
      if (sticks.length === 0) return;

      for (const { mix, index } of sticks) {
        const weights = mix.rates?.weights ?? [];
        const zero = weights.findIndex((w) => w === 0);
        const signs = new Set(weights.filter((w) => w !== 0).map(signOf));
        if (zero < 0 && signs.size < 2) continue;
        const sw = mix.rates!.control;
        const detail =
          zero >= 0
            ? `a weight of 0 at ${sw} position ${zero}, so the ${channel.role} does nothing there`
            : `weights ${weights.join(', ')} of both signs on ${sw}, so one position reverses the ${channel.role}`;
        results.push({
          message: `Mix ${mix.id} on channel ${channel.ch} (${channel.function}) has ${detail}.`,
          hint: 'Give every rates position a weight of the same sign as the others, not 0.',
          ...ref.mix(setup, index, 'rates', 'weights'),
        });
      }

      const position = disablingPosition(sticks.map((s) => s.mix), ctx.controls);
      if (position) {
        results.push({
          message: `With ${position} no mix from a stick is active on channel ${channel.ch} (${channel.function}), so the ${channel.role} does not respond to the sticks there.`,
          hint: 'Add that position to a stick mix’s active positions, or add a mix that is active there.',
          ...ref.channel(setup, ci),
        });
      }
    });
    return results;
  },
};

/** A switch setting, in words, under which none of `mixes` is active; null when there is none. */
function disablingPosition(mixes: readonly Mix[], controls: ReadonlyMap<string, { kind: string; positions?: number }>) {
  if (mixes.some((mix) => !mix.active)) return null;
  const switches = [...new Set(mixes.map((mix) => mix.active!.control))].filter(
    (id) => controls.get(id)?.kind === 'switch',
  );
  if (switches.length === 0 || switches.length > SWITCH_LIMIT) return null;
  const sizes = switches.map((id) => controls.get(id)!.positions ?? 2);
  const position = new Array<number>(switches.length).fill(0);
  for (;;) {
    const at = (id: string) => position[switches.indexOf(id)] ?? 0;
    if (!mixes.some((mix) => mix.active!.positions.includes(at(mix.active!.control))))
      return switches.map((id, i) => `${id} at position ${position[i]}`).join(' and ');
    let i = 0;
    while (i < switches.length && ++position[i] >= sizes[i]) position[i++] = 0;
    if (i === switches.length) return null;
  }
}
