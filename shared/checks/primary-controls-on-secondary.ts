import type { Check } from './check';
import { listNames } from './context';
import { ref } from './refs';

const PRIMARY_ROLES = new Set(['aileron', 'elevator', 'rudder', 'throttle']);

export const primaryControlsOnSecondary: Check = {
  id: 'primary-controls-on-secondary',
  severity: 'warning',
  description: 'An aileron, elevator, rudder or throttle channel carried only by secondary receivers.',
  check(setup, ctx) {
    return setup.channels.flatMap((channel, i) => {
      if (!PRIMARY_ROLES.has(channel.role)) return [];
      const carriers = ctx.carriers.get(channel.ch) ?? [];
      if (carriers.length === 0 || carriers.some((carrier) => carrier.receiver.role === 'primary')) return [];
      const names = [...new Set(carriers.map((carrier) => carrier.receiver.id))];
      return [
        {
          message: `Channel ${channel.ch} (${channel.function}) is a main flight control (${channel.role}), but it is carried only by the secondary receiver${names.length > 1 ? 's' : ''} ${listNames(names)}: if the primary receiver holds the link and the secondary loses it, the model loses this control.`,
          hint: 'Put the main flight controls on the primary receiver.',
          ...ref.channel(setup, i),
        },
      ];
    });
  },
};
