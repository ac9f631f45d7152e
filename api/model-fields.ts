import { z } from 'zod';
import { SINGLE_LINE_MESSAGE, singleLine } from './validation';

// A model's name and a revision's message, as every way in checks them: the routes and
// the history import alike, so an imported revision obeys the same limits as a save.

export const modelName = z
  .string({ error: 'Give the model a name.' })
  .trim()
  .min(1, 'Give the model a name.')
  .max(80, 'Keep the name to 80 characters.')
  .refine(singleLine, SINGLE_LINE_MESSAGE);

export const message = z
  .string({ error: 'A message is text.' })
  .trim()
  .max(2000, 'Keep the message to 2000 characters.')
  .regex(/^[^\u0000]*$/, 'A message cannot contain NUL characters.');
