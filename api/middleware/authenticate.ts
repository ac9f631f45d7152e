import type { InferAttributes } from 'sequelize';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { verifySession, type SessionClaims } from '../auth/tokens';
import type { AppConfig } from '../config';
import { Unauthorized } from '../errors';
import { preparedStatement, runPrepared, type PreparedStatement } from '../db/prepared';
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
    const session = await sessionUser(result.claims);
    if (!session || session.revoked || session.user.sessionVersion !== result.claims.sv) {
      throw new Unauthorized('This session has ended. Sign in again.', { code: 'session-ended' });
    }
    req.user = session.user;
    next();
  };
}

// The account and whether this session was revoked at sign-out, in one prepared
// statement: every signed-in request pays for it, so it costs one round trip and no
// trip through Sequelize's query pipeline. The columns come under their attribute
// names, so the row builds a User as it is.
let sessionStatement: PreparedStatement | null = null;

// Built on the first request, once the models are bound, and kept.
function sessionUserStatement(): PreparedStatement {
  if (sessionStatement) return sessionStatement;
  const columns = Object.entries(User.getAttributes())
    .map(([attribute, { field }]) => `u.${field ?? attribute} AS "${attribute}"`)
    .join(', ');
  sessionStatement = preparedStatement(
    'session-user',
    `SELECT ${columns}, EXISTS (SELECT 1 FROM revoked_sessions WHERE jti = $2) AS "sessionRevoked"
       FROM users u WHERE u.id = $1`,
  );
  return sessionStatement;
}

async function sessionUser(claims: SessionClaims): Promise<{ user: User; revoked: boolean } | null> {
  const [row] = await runPrepared<InferAttributes<User> & { sessionRevoked: boolean }>(
    User.sequelize!,
    sessionUserStatement(),
    [claims.sub, claims.jti],
  );
  if (!row) return null;
  const { sessionRevoked, ...attributes } = row;
  return { user: User.build(attributes, { raw: true, isNewRecord: false }), revoked: sessionRevoked };
}

/** The caller set by `authenticate`; a route mounted without it is a programming error. */
export function currentUser(req: Request): User {
  if (!req.user) throw new Unauthorized();
  return req.user;
}
