import type { Check } from './check';
import { ref } from './refs';

export const telemetryMultiple: Check = {
  id: 'telemetry-multiple',
  severity: 'error',
  description: 'More than one receiver sends telemetry; on a shared link they talk over each other.',
  check(setup) {
    const senders = setup.receivers.map((receiver, index) => ({ receiver, index })).filter((r) => r.receiver.telemetry);
    if (senders.length < 2) return [];
    const first = senders[0].receiver.id;
    return senders.slice(1).map(({ receiver, index }) => ({
      message: `Receivers ${first} and ${receiver.id} both send telemetry; only one receiver on a link may, or their replies collide.`,
      hint: `Set telemetry: false on ${receiver.id} (and turn telemetry off on the receiver itself).`,
      ...ref.receiver(setup, index, 'telemetry'),
    }));
  },
};
