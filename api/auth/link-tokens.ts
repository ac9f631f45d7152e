import jwt from 'jsonwebtoken';
import { z } from 'zod';
import type { AppConfig } from '../config';
import { HttpError, Unauthorized } from '../errors';

// Tokens in e-mailed links (invitations, password resets): signed with the session key
// but bound to their purpose by the audience, so no link token passes as a session (it
// has no session version) and no session token passes as a link. Each names a row
// (jti) that makes it single-use and lets it be revoked.

export type LinkPurpose = 'invitation' | 'password-reset';

const ALGORITHM = 'HS256';
const audience = (purpose: LinkPurpose) => `bindery:${purpose}`;
const claimsSchema = z.object({ jti: z.uuid() });

export function signLinkToken(purpose: LinkPurpose, id: string, expiresAt: Date, config: AppConfig): string {
  return jwt.sign({ exp: Math.floor(expiresAt.getTime() / 1000) }, config.jwtSecret, {
    algorithm: ALGORITHM,
    audience: audience(purpose),
    jwtid: id,
  });
}

const WORDS: Record<LinkPurpose, string> = { invitation: 'invitation link', 'password-reset': 'password reset link' };

/** The row id the token names; 401 when it is tampered with, of another kind, or expired. */
export function verifyLinkToken(purpose: LinkPurpose, token: string, config: AppConfig): string {
  try {
    const payload = jwt.verify(token, config.jwtSecret, { algorithms: [ALGORITHM], audience: audience(purpose) });
    const claims = claimsSchema.safeParse(payload);
    if (claims.success) return claims.data.jti;
  } catch (error) {
    if (error instanceof jwt.TokenExpiredError) throw linkExpired(purpose);
  }
  throw new Unauthorized(`This ${WORDS[purpose]} is not valid. Check that the whole address was copied.`, {
    code: 'invalid-token',
  });
}

export const linkExpired = (purpose: LinkPurpose) =>
  new Unauthorized(
    `This ${WORDS[purpose]} has expired.${purpose === 'invitation' ? ' Ask the workspace owner to invite you again.' : ' Ask for a new one.'}`,
    {
      code: 'token-expired',
    },
  );

export const linkUsed = (purpose: LinkPurpose) =>
  new HttpError(410, 'gone', `This ${WORDS[purpose]} has already been used; each one works once.`, {
    code: 'token-used',
  });
