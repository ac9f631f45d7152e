import { Router, type NextFunction, type Request, type Response } from 'express';
import { rateLimit, type AugmentedRequest } from 'express-rate-limit';
import { verifyLinkToken } from '../auth/link-tokens';
import { setSessionCookie } from '../auth/session-cookie';
import { signSession } from '../auth/tokens';
import { openPasswordReset, requestPasswordReset, resetPassword } from '../commands/reset-password';
import type { AppContext } from '../context';
import { RateLimited } from '../errors';
import { mailFor } from '../mail/context';
import { presentUser } from '../presenters/user';
import { PostgresRateLimitStore } from '../security/postgres-rate-limit-store';
import { parseInput } from '../validation';
import { resetConfirmSchema, resetRequestSchema } from './team-inputs';

const ACCEPTED =
  'If an account uses that address, a message with a link to choose a new password is on its way. The link works once, for an hour.';

const WINDOW_MS = 15 * 60 * 1000;

function emailKey(req: Request): string | null {
  const body: unknown = req.body;
  const email = typeof body === 'object' && body !== null ? (body as { email?: unknown }).email : undefined;
  return typeof email === 'string' && email.trim().length > 0 ? email.trim().toLowerCase() : null;
}

// Reset mail on demand would let anyone flood an inbox; a few per address and per
// client within a window is plenty for a pilot who lost a password. Counted whether
// or not an account exists, so the limit itself tells nothing.
function resetLimiters({ sequelize }: AppContext) {
  const common = {
    windowMs: WINDOW_MS,
    standardHeaders: 'draft-8' as const,
    legacyHeaders: false,
    handler: (req: Request, _res: Response, next: NextFunction) => {
      const reset = (req as AugmentedRequest).rateLimit?.resetTime;
      const retryAfter = reset ? Math.max(1, Math.ceil((reset.getTime() - Date.now()) / 1000)) : WINDOW_MS / 1000;
      next(
        new RateLimited('Too many reset requests. Wait a while and try again.', {
          details: { retry_after_seconds: retryAfter },
        }),
      );
    },
  };
  return [
    rateLimit({ ...common, limit: 30, store: new PostgresRateLimitStore(sequelize, 'password-reset:address:') }),
    rateLimit({
      ...common,
      limit: 5,
      skip: (req) => emailKey(req) === null,
      keyGenerator: (req) => `${emailKey(req)}`,
      store: new PostgresRateLimitStore(sequelize, 'password-reset:account:'),
    }),
  ];
}

export function passwordResetRouter(context: AppContext): Router {
  const { sequelize, config } = context;
  const router = Router();

  router.post('/auth/password-reset', ...resetLimiters(context), async (req, res) => {
    const { email } = parseInput(resetRequestSchema, req.body);
    await requestPasswordReset(sequelize, config, mailFor(context), email);
    res.status(202).json({ data: { message: ACCEPTED } });
  });

  router.get('/auth/password-reset/:token', async (req, res) => {
    const user = await openPasswordReset(verifyLinkToken('password-reset', req.params.token, config));
    res.json({ data: { email: user.email } });
  });

  router.post('/auth/password-reset/:token', async (req, res) => {
    const id = verifyLinkToken('password-reset', req.params.token, config);
    const { password } = parseInput(resetConfirmSchema, req.body);
    const user = await resetPassword(sequelize, id, password);
    const token = signSession(user, config);
    setSessionCookie(res, token, config);
    res.json({ data: { user: presentUser(user), token } });
  });

  return router;
}
