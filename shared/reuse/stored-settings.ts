import { z } from 'zod';

// What a physical receiver itself holds, as last recorded on the shelf: whether it
// sends telemetry and, per output pin, the channel it carries and its failsafe. This
// lives in the unit, not in any setup, which is why it can disagree with the airframe
// the unit is moved into.

export const STORED_FAILSAFE_MODES = ['hold', 'off'] as const;

/** A pulse in microseconds, `hold`, `off`, or null when the unit is left at its own default. */
export const storedFailsafeSchema = z.union([
  z
    .int({ error: 'A failsafe pulse is a whole number of microseconds.' })
    .min(700, 'A failsafe pulse is at least 700 µs.')
    .max(2300, 'A failsafe pulse is at most 2300 µs.'),
  z.enum(STORED_FAILSAFE_MODES, { error: 'A failsafe is a pulse in microseconds, hold, off or null.' }),
  z.null(),
]);

export const storedPinSchema = z.strictObject({
  pin: z.int().min(1).max(32),
  ch: z.int().min(1).max(32),
  failsafe: storedFailsafeSchema.default(null),
});

export const storedSettingsSchema = z
  .strictObject({
    telemetry: z.boolean({ error: 'telemetry is true or false.' }),
    pins: z.array(storedPinSchema).max(32),
  })
  .superRefine((settings, ctx) => {
    const seen = new Set<number>();
    settings.pins.forEach((entry, index) => {
      if (seen.has(entry.pin))
        ctx.addIssue({ code: 'custom', path: ['pins', index, 'pin'], message: `Pin ${entry.pin} is listed twice.` });
      seen.add(entry.pin);
    });
  })
  .transform((settings) => ({ ...settings, pins: [...settings.pins].sort((a, b) => a.pin - b.pin) }));

export type StoredFailsafe = z.output<typeof storedFailsafeSchema>;
export type StoredPin = z.output<typeof storedPinSchema>;
export type StoredSettings = z.output<typeof storedSettingsSchema>;

/** How a stored failsafe reads in a sentence: "988 µs", "hold", "off", "not set". */
export function describeFailsafe(failsafe: StoredFailsafe | undefined): string {
  if (failsafe === null || failsafe === undefined) return 'not set';
  return typeof failsafe === 'number' ? `${failsafe} µs` : failsafe;
}
