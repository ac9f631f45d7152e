import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { QueryTypes } from 'sequelize';
import { verifySession, type SessionClaims } from '../auth/tokens';
import type { AppConfig } from '../config';
import { Unauthorized } from '../errors';
import { User } from '../models';

declare global {
  namespace Express {
    interface Request {
      /** Set by `authenticate` on every route that needs a signed-in caller. */
      user?: User;
    }
  }
}

export function tokenFrom(req: Request, cookieName: string): string | null {
  const header = req.get('authorization');
  if (header !== undefined) {
    const match = /^Bearer\s+(\S+)\s*$/i.exec(header);
    if (!match) throw new Unauthorized('The Authorization header must be "Bearer <token>".', { code: 'invalid-token' });
    return match[1];
  }
  const cookie: unknown = req.cookies?.[cookieName];
  return typeof cookie === 'string' && cookie.length > 0 ? cookie : null;
}

/** Requires a valid session (Bearer token first, then the session cookie); sets `req.user`. */
export function authenticate(config: AppConfig): RequestHandler {
  return async (req: Request, _res: Response, next: NextFunction) => {
    const token = tokenFrom(req, config.cookieName);
    if (!token) throw new Unauthorized();
    const result = verifySession(token, config);
    if (!result.ok) {
      throw result.reason === 'expired'
        ? new Unauthorized('Your session has expired. Sign in again.', { code: 'session-expired' })
        : new Unauthorized('The session token is not valid. Sign in again.', { code: 'invalid-token' });
    }
    const [user, revoked] = await Promise.all([User.findByPk(result.claims.sub), isRevoked(result.claims)]);
    if (!user || user.sessionVersion !== result.claims.sv || revoked) {
      throw new Unauthorized('This session has ended. Sign in again.', { code: 'session-ended' });
    }
    req.user = user;
    next();
  };
}

async function isRevoked(claims: SessionClaims): Promise<boolean> {
  const rows = await User.sequelize!.query('SELECT 1 FROM revoked_sessions WHERE jti = $jti', {
    bind: { jti: claims.jti },
    type: QueryTypes.SELECT,
  });
  return rows.length > 0;
}

/** The caller set by `authenticate`; a route mounted without it is a programming error. */
export function currentUser(req: Request): User {
  if (!req.user) throw new Unauthorized();
  return req.user;
}
