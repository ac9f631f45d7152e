import { Router, type NextFunction, type Request, type Response } from 'express';
import { ipKeyGenerator, rateLimit, type AugmentedRequest, type RateLimitRequestHandler } from 'express-rate-limit';
import { z } from 'zod';
import { PASSWORD_MAX_BYTES, PASSWORD_MIN_LENGTH, verifyPassword } from '../auth/passwords';
import { clearSessionCookie, setSessionCookie } from '../auth/session-cookie';
import { signSession, verifySession } from '../auth/tokens';
import { createAccount } from '../commands/create-account';
import type { AppContext } from '../context';
import { RateLimited, Unauthorized } from '../errors';
import { authenticate, currentUser, tokenFrom } from '../middleware/authenticate';
import { User } from '../models';
import { PostgresRateLimitStore } from '../security/postgres-rate-limit-store';
import { presentUser } from '../presenters/user';
import { SINGLE_LINE_MESSAGE, parseInput, singleLine } from '../validation';

const signUpSchema = z.object({
  email: z
    .string({ error: 'Enter your e-mail address.' })
    .trim()
    .toLowerCase()
    .min(1, 'Enter your e-mail address.')
    .max(254, 'An e-mail address has at most 254 characters.')
    .pipe(z.email({ error: 'Enter a valid e-mail address, like pilot@example.com.' })),
  name: z
    .string({ error: 'Enter your name.' })
    .trim()
    .min(1, 'Enter your name.')
    .max(100, 'Keep the name to 100 characters.')
    .refine(singleLine, SINGLE_LINE_MESSAGE),
  password: z
    .string({ error: 'Choose a password.' })
    .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters.`)
    .refine(
      (value) => Buffer.byteLength(value) <= PASSWORD_MAX_BYTES,
      `Use at most ${PASSWORD_MAX_BYTES} bytes (about ${PASSWORD_MAX_BYTES} plain letters).`,
    ),
});

const signInSchema = z.object({
  email: z
    .string({ error: 'Enter your e-mail address.' })
    .trim()
    .toLowerCase()
    .min(1, 'Enter your e-mail address.')
    .max(254, 'An e-mail address has at most 254 characters.'),
  password: z
    .string({ error: 'Enter your password.' })
    .min(1, 'Enter your password.')
    .max(1024, 'That password is too long.'),
});

function accountKey(req: Request): string | null {
  const body: unknown = req.body;
  const email = typeof body === 'object' && body !== null ? (body as { email?: unknown }).email : undefined;
  return typeof email === 'string' && email.trim().length > 0 ? email.trim().toLowerCase() : null;
}

// Three counters of failed attempts, all in PostgreSQL: per client address (trying many
// accounts); per account and client address (guessing one password), which locks out
// only the address doing the guessing; and per account from all addresses, higher, so
// a guesser spread over many addresses is still stopped while a stranger's few wrong
// attempts never lock the owner out from their own address. Only failures count, so a
// pilot who signs in often is never locked out.
function signInLimiters({ sequelize, config }: AppContext): RateLimitRequestHandler[] {
  const { windowMs, perAccount, perAccountAnyAddress, perAddress } = config.signInLimits;
  const common = {
    windowMs,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8' as const,
    legacyHeaders: false,
    handler: (req: Request, _res: Response, next: NextFunction) => {
      const reset = (req as AugmentedRequest).rateLimit?.resetTime;
      const retryAfter = reset
        ? Math.max(1, Math.ceil((reset.getTime() - Date.now()) / 1000))
        : Math.ceil(windowMs / 1000);
      next(
        new RateLimited('Too many failed sign-in attempts. Wait a while and try again.', {
          details: { retry_after_seconds: retryAfter },
        }),
      );
    },
  };
  const store = (prefix: string) => new PostgresRateLimitStore(sequelize, prefix);
  const noAccount = (req: Request) => accountKey(req) === null;
  return [
    rateLimit({ ...common, limit: perAddress, store: store('sign-in:address:') }),
    rateLimit({
      ...common,
      limit: perAccount,
      skip: noAccount,
      keyGenerator: (req) => `${accountKey(req)} ${ipKeyGenerator(req.ip ?? '')}`,
      store: store('sign-in:account-address:'),
    }),
    rateLimit({
      ...common,
      limit: perAccountAnyAddress,
      skip: noAccount,
      keyGenerator: (req) => `${accountKey(req)}`,
      store: store('sign-in:account:'),
    }),
  ];
}

export function authRouter(context: AppContext): Router {
  const { sequelize, config } = context;
  const router = Router();

  router.post('/auth/sign-up', async (req, res) => {
    const input = parseInput(signUpSchema, req.body);
    const { user } = await createAccount(sequelize, input);
    const token = signSession(user, config);
    setSessionCookie(res, token, config);
    res.status(201).json({ data: { user: presentUser(user), token } });
  });

  router.post('/auth/sign-in', ...signInLimiters(context), async (req, res) => {
    const input = parseInput(signInSchema, req.body);
    const user = await User.findOne({ where: { email: input.email } });
    if (!(await verifyPassword(input.password, user?.passwordHash ?? null)) || !user) {
      throw new Unauthorized('The e-mail address or the password is wrong.', { code: 'invalid-credentials' });
    }
    const token = signSession(user, config);
    setSessionCookie(res, token, config);
    res.json({ data: { user: presentUser(user), token } });
  });

  // Needs no valid session: a browser holding an expired cookie must still be able to drop it.
  // A valid token it was sent with is revoked on the server, so a copy of it stops working too.
  router.post('/auth/sign-out', async (req, res) => {
    const token = tokenFrom(req, config.cookieName);
    const result = token ? verifySession(token, config) : null;
    if (result?.ok) {
      await sequelize.query(
        `INSERT INTO revoked_sessions (jti, user_id, expires_at)
         SELECT $jti, id, to_timestamp($exp) FROM users WHERE id = $sub
         ON CONFLICT (jti) DO NOTHING`,
        { bind: { jti: result.claims.jti, sub: result.claims.sub, exp: result.claims.exp } },
      );
      // Revocations are needed only until the token would have expired anyway.
      await sequelize.query('DELETE FROM revoked_sessions WHERE expires_at < now()');
    }
    clearSessionCookie(res, config);
    res.json({ data: { signed_out: true } });
  });

  router.post('/auth/sign-out-everywhere', authenticate(config), async (req, res) => {
    const user = currentUser(req);
    await user.increment('sessionVersion');
    clearSessionCookie(res, config);
    res.json({ data: { signed_out: true } });
  });

  return router;
}
