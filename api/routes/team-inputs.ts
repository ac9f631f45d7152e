import { SINGLE_LINE_MESSAGE, singleLine } from '../validation';
import { z } from 'zod';
import { PASSWORD_MAX_BYTES, PASSWORD_MIN_LENGTH } from '../auth/passwords';
import { ROLES } from '@shared/contract/roles';

// Input shapes of the team, invitation and password-reset routes; the same wording as sign-up.

export const emailField = z
  .string({ error: 'Enter an e-mail address.' })
  .trim()
  .toLowerCase()
  .min(1, 'Enter an e-mail address.')
  .max(254, 'An e-mail address has at most 254 characters.')
  .pipe(z.email({ error: 'Enter a valid e-mail address, like pilot@example.com.' }));

export const roleField = z.enum(ROLES, { error: `role is one of ${ROLES.join(', ')}.` });

export const nameField = z
  .string({ error: 'Enter your name.' })
  .trim()
  .min(1, 'Enter your name.')
  .max(100, 'Keep the name to 100 characters.')
  .refine(singleLine, SINGLE_LINE_MESSAGE);

export const passwordField = z
  .string({ error: 'Choose a password.' })
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters.`)
  .refine(
    (value) => Buffer.byteLength(value) <= PASSWORD_MAX_BYTES,
    `Use at most ${PASSWORD_MAX_BYTES} bytes (about ${PASSWORD_MAX_BYTES} plain letters).`,
  );

export const inviteSchema = z.strictObject({ email: emailField, role: roleField });

export const changeRoleSchema = z.strictObject({ role: roleField });

// Either nothing (the signed-in caller joins) or a name and a password for a new account.
export const acceptSchema = z
  .strictObject({ name: nameField.optional(), password: passwordField.optional() })
  .superRefine((value, context) => {
    if (value.name !== undefined && value.password === undefined)
      context.addIssue({ code: 'custom', path: ['password'], message: 'Choose a password for the new account.' });
    if (value.password !== undefined && value.name === undefined)
      context.addIssue({ code: 'custom', path: ['name'], message: 'Enter your name for the new account.' });
  });

export const resetRequestSchema = z.strictObject({ email: emailField });

export const resetConfirmSchema = z.strictObject({ password: passwordField });
