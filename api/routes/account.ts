import { Router, type NextFunction, type Request, type Response } from 'express';
import { rateLimit, type AugmentedRequest } from 'express-rate-limit';
import { z } from 'zod';
import { setSessionCookie } from '../auth/session-cookie';
import { signSession } from '../auth/tokens';
import { changePassword } from '../commands/change-password';
import type { AppContext } from '../context';
import { RateLimited } from '../errors';
import { authenticate, currentUser } from '../middleware/authenticate';
import { presentUser } from '../presenters/user';
import { PostgresRateLimitStore } from '../security/postgres-rate-limit-store';
import { parseInput } from '../validation';
import { passwordField } from './team-inputs';

const changePasswordSchema = z.strictObject({
  current: z
    .string({ error: 'Enter your current password.' })
    .min(1, 'Enter your current password.')
    .max(1024, 'That password is too long.'),
  password: passwordField,
});

// A stolen session must not become a way to guess the password: wrong current
// passwords count per account, like failed sign-ins.
function wrongPasswordLimiter({ sequelize, config }: AppContext) {
  const { windowMs, perAccount } = config.signInLimits;
  return rateLimit({
    windowMs,
    limit: perAccount,
    // Only a wrong current password (403) counts against the limit.
    requestWasSuccessful: (_req, res) => res.statusCode !== 403,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => currentUser(req).id,
    store: new PostgresRateLimitStore(sequelize, 'password-change:account:'),
    handler: (req: Request, _res: Response, next: NextFunction) => {
      const reset = (req as AugmentedRequest).rateLimit?.resetTime;
      const retryAfter = reset
        ? Math.max(1, Math.ceil((reset.getTime() - Date.now()) / 1000))
        : Math.ceil(windowMs / 1000);
      next(
        new RateLimited('Too many wrong passwords. Wait a while and try again.', {
          details: { retry_after_seconds: retryAfter },
        }),
      );
    },
  });
}

export function accountRouter(context: AppContext): Router {
  const { sequelize, config } = context;
  const router = Router();

  // Ends every session of the account (like sign-out everywhere) and signs this device in again.
  router.post('/auth/password', authenticate(config), wrongPasswordLimiter(context), async (req, res) => {
    const input = parseInput(changePasswordSchema, req.body);
    const user = await changePassword(sequelize, currentUser(req), input);
    const token = signSession(user, config);
    setSessionCookie(res, token, config);
    res.json({ data: { user: presentUser(user), token } });
  });

  return router;
}
