import { z } from 'zod';
import { storedSettingsSchema } from './stored-settings';

// A receiver's shelf record as the shelf's forms and the API accept it. The mark is
// what the pilot put on the case ("Red tape, two stripes"); its colour is optional and
// only ever drawn beside that text, never instead of it.

export const MARK_COLOURS = [
  'red',
  'orange',
  'yellow',
  'green',
  'blue',
  'purple',
  'pink',
  'white',
  'black',
  'grey',
] as const;
export type MarkColour = (typeof MARK_COLOURS)[number];

/** Swatch fills for the physical colours of tape and paint dots. */
export const MARK_SWATCHES: Record<MarkColour, string> = {
  red: '#c8312b',
  orange: '#e07b24',
  yellow: '#f2c230',
  green: '#3b8c4a',
  blue: '#2d6cc0',
  purple: '#7a4aa8',
  pink: '#e27aa8',
  white: '#ffffff',
  black: '#1b1b1b',
  grey: '#8c8c8c',
};

const trimmed = (max: number, what: string) =>
  z
    .string({ error: `${what} is text.` })
    .trim()
    .max(max, `${what} is at most ${max} characters.`);
const oneLine = (max: number, what: string) =>
  trimmed(max, what).regex(/^[^\u0000-\u001f\u007f]*$/, `${what} is one line without control characters.`);

export const receiverFields = {
  label: oneLine(80, 'The label').min(1, 'Give the receiver a label.'),
  // An empty mark is no mark.
  mark: oneLine(80, 'The mark')
    .nullable()
    .transform((mark) => (mark ? mark : null)),
  mark_colour: z.enum(MARK_COLOURS, { error: `The mark colour is one of ${MARK_COLOURS.join(', ')}.` }).nullable(),
  outputs: z
    .int({ error: 'Outputs is a whole number.' })
    .min(1, 'A receiver has at least 1 output.')
    .max(32, 'At most 32 outputs.'),
  notes: trimmed(2000, 'The notes').regex(/^[^\u0000]*$/, 'The notes cannot contain NUL characters.'),
  stored_settings: storedSettingsSchema.nullable(),
};

function pinsFit(
  input: { outputs?: number; stored_settings?: { pins: { pin: number }[] } | null },
  ctx: z.RefinementCtx,
) {
  if (input.outputs === undefined || !input.stored_settings) return;
  input.stored_settings.pins.forEach((entry, index) => {
    if (entry.pin > input.outputs!) {
      ctx.addIssue({
        code: 'custom',
        path: ['stored_settings', 'pins', index, 'pin'],
        message: `Pin ${entry.pin} is above the unit's ${input.outputs} outputs.`,
      });
    }
  });
}

export const createReceiverSchema = z
  .strictObject({
    label: receiverFields.label,
    mark: receiverFields.mark.optional(),
    mark_colour: receiverFields.mark_colour.optional(),
    outputs: receiverFields.outputs,
    notes: receiverFields.notes.optional(),
    stored_settings: receiverFields.stored_settings.optional(),
  })
  .superRefine(pinsFit);

/** Every field optional; the outputs check against the stored pins happens on the merged record. */
export const updateReceiverSchema = z
  .strictObject({
    label: receiverFields.label.optional(),
    mark: receiverFields.mark.optional(),
    mark_colour: receiverFields.mark_colour.optional(),
    outputs: receiverFields.outputs.optional(),
    notes: receiverFields.notes.optional(),
    stored_settings: receiverFields.stored_settings.optional(),
  })
  .refine((input) => Object.keys(input).length > 0, { message: 'Send at least one field to change.' });

export type CreateReceiverInput = z.input<typeof createReceiverSchema>;
export type UpdateReceiverInput = z.input<typeof updateReceiverSchema>;
