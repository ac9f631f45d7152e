import type { Check, CheckResult } from './check';
import { ref, type Ref } from './refs';

function duplicates<T>(
  items: readonly T[],
  keyOf: (item: T) => string | number,
  report: (index: number, firstIndex: number) => CheckResult,
) {
  const first = new Map<string | number, number>();
  const results: CheckResult[] = [];
  items.forEach((item, index) => {
    const key = keyOf(item);
    const seen = first.get(key);
    if (seen === undefined) first.set(key, index);
    else results.push(report(index, seen));
  });
  return results;
}

const withAt = (r: Ref, tail: string): Ref => ({ path: r.path, at: [...r.at, tail] });

export const duplicateId: Check = {
  id: 'duplicate-id',
  severity: 'error',
  description:
    "Two entries with the same identity key in one list (controls, channels, mixes, receivers, a receiver's map), or two channels with the same function.",
  check(setup) {
    return [
      ...duplicates(
        setup.controls,
        (c) => c.id,
        (i) => ({
          message: `Two controls have the id ${setup.controls[i].id}, so mixes and switches that name it are ambiguous.`,
          hint: 'Give each control its own id.',
          ...withAt(ref.control(setup, i), 'id'),
        }),
      ),
      ...duplicates(
        setup.channels,
        (c) => c.function,
        (i, first) => ({
          message: `Channels ${setup.channels[first].ch} and ${setup.channels[i].ch} both drive the function ${setup.channels[i].function}.`,
          hint: "Name each channel's function differently, e.g. with -left and -right.",
          ...ref.channel(setup, i, 'function'),
        }),
      ),
      ...duplicates(
        setup.mixes,
        (m) => m.id,
        (i) => ({
          message: `Two mixes have the id ${setup.mixes[i].id}.`,
          hint: 'Give each mix its own id.',
          ...withAt(ref.mix(setup, i), 'id'),
        }),
      ),
      ...duplicates(
        setup.receivers,
        (r) => r.id,
        (i) => ({
          message: `Two receivers have the id ${setup.receivers[i].id}, so they cannot be told apart.`,
          hint: 'Give each receiver its own id, e.g. after where it sits in the model.',
          ...withAt(ref.receiver(setup, i), 'id'),
        }),
      ),
      ...setup.receivers.flatMap((receiver, ri) =>
        duplicates(
          receiver.map,
          (e) => e.pin,
          (pi, first) => ({
            message: `Receiver ${receiver.id} maps pin ${receiver.map[pi].pin} twice (to channels ${receiver.map[first].ch} and ${receiver.map[pi].ch}); a pin carries one channel.`,
            hint: 'Keep one map entry per pin.',
            ...withAt(ref.pin(setup, ri, pi), 'pin'),
          }),
        ),
      ),
    ];
  },
};
