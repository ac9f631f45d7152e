import { isApiError, type FieldErrors } from './api-client';

export interface FormErrors {
  /** Messages to show beside the named fields of this form. */
  fields: FieldErrors;
  /** A message for the top of the form: not about one of its fields. */
  general: string | null;
}

export const noFormErrors: FormErrors = { fields: {}, general: null };

/**
 * Splits a failed request into messages per field of this form and one general
 * message; a server message about a field this form does not have goes to the top so
 * it is never lost.
 */
export function formErrorsFrom(error: unknown, formFields: readonly string[]): FormErrors {
  if (!isApiError(error)) {
    return { fields: {}, general: error instanceof Error ? error.message : 'Something went wrong. Try again.' };
  }
  const fields: FieldErrors = {};
  const elsewhere: string[] = [];
  for (const [name, message] of Object.entries(error.fields)) {
    if (formFields.includes(name)) fields[name] = message;
    else elsewhere.push(message);
  }
  if (Object.keys(fields).length > 0) return { fields, general: elsewhere.length > 0 ? elsewhere.join(' ') : null };
  return { fields, general: elsewhere.length > 0 ? elsewhere.join(' ') : error.message };
}
