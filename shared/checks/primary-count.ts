import type { Check } from './check';
import { listNames } from './context';
import { ref } from './refs';

export const primaryCount: Check = {
  id: 'primary-count',
  severity: 'error',
  description: 'Several receivers, but not exactly one with role primary.',
  check(setup) {
    if (setup.receivers.length < 2) return [];
    const primaries = setup.receivers
      .map((receiver, index) => ({ receiver, index }))
      .filter((r) => r.receiver.role === 'primary');
    if (primaries.length === 0) {
      return [
        {
          message: `None of the ${setup.receivers.length} receivers has the role primary, so it is unclear which one is the main unit: the one that should carry the main controls and send telemetry.`,
          hint: 'Set role: primary on the receiver that carries the main controls.',
          ...ref.root('receivers'),
        },
      ];
    }
    if (primaries.length === 1) return [];
    const names = listNames(primaries.map((p) => p.receiver.id));
    return primaries.slice(1).map(({ receiver, index }) => ({
      message: `Receivers ${names} ${primaries.length === 2 ? 'both' : 'all'} have the role primary (role defaults to primary); exactly one may.`,
      hint: `Set role: secondary on ${receiver.id} unless it is the main receiver.`,
      ...ref.receiver(setup, index, 'role'),
    }));
  },
};
