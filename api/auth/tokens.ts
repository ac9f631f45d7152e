import jwt from 'jsonwebtoken';
import { z } from 'zod';
import type { AppConfig } from '../config';

const ALGORITHM = 'HS256';

const claimsSchema = z.object({ sub: z.uuid(), sv: z.number().int().positive() });
export type SessionClaims = z.output<typeof claimsSchema>;

export function signSession(user: { id: string; sessionVersion: number }, config: AppConfig): string {
  return jwt.sign({ sv: user.sessionVersion }, config.jwtSecret, {
    algorithm: ALGORITHM,
    expiresIn: config.tokenTtlSeconds,
    subject: user.id,
  });
}

export type VerifyResult = { ok: true; claims: SessionClaims } | { ok: false; reason: 'expired' | 'invalid' };

export function verifySession(token: string, config: AppConfig): VerifyResult {
  try {
    // Pinning the algorithm refuses `alg: none` and any key-confusion trick.
    const payload = jwt.verify(token, config.jwtSecret, { algorithms: [ALGORITHM] });
    const claims = claimsSchema.safeParse(payload);
    return claims.success ? { ok: true, claims: claims.data } : { ok: false, reason: 'invalid' };
  } catch (error) {
    return { ok: false, reason: error instanceof jwt.TokenExpiredError ? 'expired' : 'invalid' };
  }
}
