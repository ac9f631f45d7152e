import type { Check } from './check';
import { ref } from './refs';

// Only one receiver on a link should send telemetry (common practice, docs/sources.md); it
// should be the one whose link matters most.
export const telemetryOnSecondary: Check = {
  id: 'telemetry-on-secondary',
  severity: 'warning',
  description:
    "The only receiver that sends telemetry is a secondary: the pilot's link warnings watch the less important unit.",
  check(setup) {
    const senders = setup.receivers.map((receiver, index) => ({ receiver, index })).filter((r) => r.receiver.telemetry);
    if (senders.length !== 1 || senders[0].receiver.role !== 'secondary') return [];
    const { receiver, index } = senders[0];
    return [
      {
        message: `Only receiver ${receiver.id}, a secondary, sends telemetry: the transmitter's link-quality warnings report on it, so the primary receiver could lose the link without a warning.`,
        hint: 'Send telemetry from the primary receiver and set telemetry: false on the secondary.',
        ...ref.receiver(setup, index, 'telemetry'),
      },
    ];
  },
};
