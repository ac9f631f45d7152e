import bcrypt from 'bcryptjs';

export const BCRYPT_COST = 12;
export const PASSWORD_MIN_LENGTH = 10;
// bcrypt reads only the first 72 bytes; a longer password would silently lose its tail.
export const PASSWORD_MAX_BYTES = 72;

export const hashPassword = (password: string): Promise<string> => bcrypt.hash(password, BCRYPT_COST);

// Compared against when the e-mail is unknown, so a miss costs as long as a wrong password.
const unknownUserHash = bcrypt.hashSync('no account has this password', BCRYPT_COST);

export async function verifyPassword(password: string, hash: string | null): Promise<boolean> {
  const matches = await bcrypt.compare(password, hash ?? unknownUserHash);
  return hash !== null && matches;
}
