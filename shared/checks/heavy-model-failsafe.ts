import type { Check, CheckResult } from './check';
import { ref } from './refs';

// Above this weight a throttle failsafe is an absolute requirement (see docs/sources.md, cap-658).
export const HEAVY_MODEL_G = 7000;

export const heavyModelFailsafe: Check = {
  id: 'heavy-model-failsafe',
  severity: 'error',
  description: `model.weight_g above ${HEAVY_MODEL_G} and a throttle pin whose failsafe is unset.`,
  check(setup, ctx) {
    const weight = setup.model.weight_g;
    if (weight === undefined || weight <= HEAVY_MODEL_G) return [];
    const results: CheckResult[] = [];
    setup.receivers.forEach((receiver, ri) =>
      receiver.map.forEach((entry, pi) => {
        if (entry.failsafe !== undefined) return;
        const throttle = ctx.planned.get(entry.ch)?.find((p) => p.channel.role === 'throttle');
        if (!throttle) return;
        results.push({
          message: `The model weighs ${weight} g, over ${HEAVY_MODEL_G} g, and pin ${entry.pin} of receiver ${receiver.id} carries the throttle (${throttle.channel.function}) without a failsafe; a model this heavy must close the throttle on signal loss.`,
          hint: "Set the pin's failsafe to the idle pulse, and set it on the receiver too.",
          ...ref.pin(setup, ri, pi),
        });
      }),
    );
    return results;
  },
};
