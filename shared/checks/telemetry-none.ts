import type { Check } from './check';
import { ref } from './refs';

export const telemetryNone: Check = {
  id: 'telemetry-none',
  severity: 'info',
  description: 'No receiver sends telemetry.',
  check(setup) {
    if (setup.receivers.some((receiver) => receiver.telemetry)) return [];
    return [
      {
        message:
          'No receiver sends telemetry, so the transmitter gets no signal-strength or battery reports from the model.',
        hint: 'Set telemetry: true on one receiver, usually the primary, if you want those reports.',
        ...ref.root('receivers'),
      },
    ];
  },
};
