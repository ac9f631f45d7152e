import type { FieldErrors } from '../../lib/api-client';

// The same rules the server applies, checked first here so a slip is shown at once;
// the server's answer still decides and its messages are shown the same way.
export const PASSWORD_MIN_LENGTH = 10;
/** Said under every field where a password is chosen. */
export const PASSWORD_HINT = `At least ${PASSWORD_MIN_LENGTH} characters.`;

const EMAIL_SHAPE = /^[^\s@]+@[^\s@]+\.[^\s@]+$/;

export function validateEmail(email: string): string | null {
  if (!email.trim()) return 'Enter your e-mail address.';
  if (!EMAIL_SHAPE.test(email.trim())) return 'Enter an e-mail address like name@example.org.';
  return null;
}

/** A password being chosen: the account's, a reset's, an invited newcomer's. */
export function validateNewPassword(password: string): string | null {
  return password.length < PASSWORD_MIN_LENGTH ? `Use at least ${PASSWORD_MIN_LENGTH} characters.` : null;
}

export function validateName(name: string): string | null {
  return name.trim() ? null : 'Enter the name your club mates know you by.';
}

export function validateSignIn(input: { email: string; password: string }): FieldErrors {
  const errors: FieldErrors = {};
  if (!input.email.trim()) errors.email = 'Enter your e-mail address.';
  if (!input.password) errors.password = 'Enter your password.';
  return errors;
}

export function validateSignUp(input: { email: string; name: string; password: string }): FieldErrors {
  const errors: FieldErrors = {};
  const email = validateEmail(input.email);
  if (email) errors.email = email;
  const name = validateName(input.name);
  if (name) errors.name = name;
  const password = validateNewPassword(input.password);
  if (password) errors.password = password;
  return errors;
}
