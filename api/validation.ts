import { z } from 'zod';
import { BadRequest } from './errors';

// Field errors keyed by dotted path so a form can put each message beside its input:
// `details: { fields: { email: "Enter a valid e-mail address." } }`.
export function fieldErrors(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const prefix = issue.path.map(String);
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) fields[[...prefix, key].join('.')] ??= 'This field is not known here.';
      continue;
    }
    const key = prefix.length > 0 ? prefix.join('.') : '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

export function parseInput<S extends z.ZodType>(
  schema: S,
  input: unknown,
  message = 'Some fields need attention.',
): z.output<S> {
  const result = schema.safeParse(input ?? {});
  if (!result.success) {
    throw new BadRequest(message, { code: 'invalid-input', details: { fields: fieldErrors(result.error) } });
  }
  return result.data;
}

// Ids in paths: anything that is not a UUID cannot name a record, so it is simply not found.
export const idSchema = z.uuid();

// Names and titles are one line of text. NUL cannot be stored faithfully, and CR/LF in a
// name that reaches a mail subject would add header lines; every other control
// character is refused with them, so the rule is the same everywhere.
const CONTROL = /[\u0000-\u001f\u007f]/;
export const SINGLE_LINE_MESSAGE = 'Use one line of plain text: no line breaks, tabs or control characters.';

/** The one refinement every single-line name or title field shares. */
export const singleLine = (value: string): boolean => !CONTROL.test(value);
