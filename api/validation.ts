import { z } from 'zod';
import { BadRequest } from './errors';

// Field errors keyed by dotted path so a form can put each message beside its input:
// `details: { fields: { email: "Enter a valid e-mail address." } }`.
export function fieldErrors(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length > 0 ? issue.path.map(String).join('.') : '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

export function parseInput<S extends z.ZodType>(schema: S, input: unknown, message = 'Some fields need attention.'): z.output<S> {
  const result = schema.safeParse(input ?? {});
  if (!result.success) {
    throw new BadRequest(message, { code: 'invalid-input', details: { fields: fieldErrors(result.error) } });
  }
  return result.data;
}

// Ids in paths: anything that is not a UUID cannot name a record, so it is simply not found.
export const idSchema = z.uuid();
