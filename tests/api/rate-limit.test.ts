import { QueryTypes } from 'sequelize';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import type { User } from '@api/models';
import { createUser, TEST_PASSWORD, uniqueEmail } from './helpers/factories';
import { useTestApp } from './helpers/test-app';

const t = useTestApp();
let alice: User;
let bruno: User;

beforeAll(async () => {
  alice = await createUser({ email: uniqueEmail('alice') });
  bruno = await createUser({ email: uniqueEmail('bruno') });
});

interface Limits {
  perAccount: number;
  perAccountAnyAddress: number;
  perAddress: number;
}

// The counters live in PostgreSQL and outlast any one app, so each test signs in from
// client addresses of its own (behind one trusted proxy, as TRUST_PROXY=1 sets) and
// with accounts of its own where a count must start at zero.
let nextAddress = 1;
const freshAddress = () => `198.51.100.${nextAddress++}`;
const limitedApp = (limits: Limits) => t.appWith({ trustProxy: 1, signInLimits: { windowMs: 60_000, ...limits } }).app;
const attempt = (app: Parameters<typeof request>[0], from: string, email: string, password: string) =>
  request(app).post('/api/auth/sign-in').set('X-Forwarded-For', from).send({ email, password });

describe('sign-in rate limits', () => {
  it('locks one account at one address after its allowed failures, even for the right password', async () => {
    const app = limitedApp({ perAccount: 3, perAccountAnyAddress: 100, perAddress: 100 });
    const from = freshAddress();
    for (let i = 0; i < 3; i++) await attempt(app, from, alice.email, 'wrong-password-x').expect(401);
    const blocked = await attempt(app, from, alice.email, TEST_PASSWORD).expect(429);
    expect(blocked.body.error.code).toBe('rate-limited');
    expect(blocked.body.error.details.retry_after_seconds).toBeGreaterThan(0);
    expect(blocked.headers['ratelimit']).toBeDefined();
    // The e-mail is the key whatever its spelling.
    await attempt(app, from, alice.email.toUpperCase(), TEST_PASSWORD).expect(429);
    await attempt(app, from, bruno.email, TEST_PASSWORD).expect(200);
  });

  it("does not let a stranger's wrong attempts from another address lock the owner out", async () => {
    const owner = await createUser({ email: uniqueEmail('owner') });
    const app = limitedApp({ perAccount: 10, perAccountAnyAddress: 100, perAddress: 50 });
    const stranger = freshAddress();
    for (let i = 0; i < 10; i++) await attempt(app, stranger, owner.email, 'wrong-password-x').expect(401);
    await attempt(app, stranger, owner.email, TEST_PASSWORD).expect(429);
    await attempt(app, freshAddress(), owner.email, TEST_PASSWORD).expect(200);
  });

  it('stops a guesser spread over many addresses at the per-account limit', async () => {
    const target = await createUser({ email: uniqueEmail('target') });
    const app = limitedApp({ perAccount: 2, perAccountAnyAddress: 4, perAddress: 100 });
    for (let i = 0; i < 2; i++) {
      const from = freshAddress();
      for (let j = 0; j < 2; j++) await attempt(app, from, target.email, 'wrong-password-x').expect(401);
    }
    const blocked = await attempt(app, freshAddress(), target.email, TEST_PASSWORD).expect(429);
    expect(blocked.body.error.code).toBe('rate-limited');
  });

  it('limits one address trying many accounts', async () => {
    const app = limitedApp({ perAccount: 100, perAccountAnyAddress: 100, perAddress: 4 });
    const from = freshAddress();
    for (let i = 0; i < 4; i++) await attempt(app, from, uniqueEmail('guess'), 'wrong-password-x').expect(401);
    const blocked = await attempt(app, from, bruno.email, TEST_PASSWORD).expect(429);
    expect(blocked.body.error.code).toBe('rate-limited');
  });

  it('does not count successful sign-ins', async () => {
    const app = limitedApp({ perAccount: 2, perAccountAnyAddress: 2, perAddress: 2 });
    const from = freshAddress();
    for (let i = 0; i < 4; i++) await attempt(app, from, bruno.email, TEST_PASSWORD).expect(200);
  });

  it('keeps the counts across a new app instance on the same database', async () => {
    const user = await createUser({ email: uniqueEmail('restart') });
    const limits = { perAccount: 3, perAccountAnyAddress: 100, perAddress: 100 };
    const from = freshAddress();
    const before = limitedApp(limits);
    for (let i = 0; i < 3; i++) await attempt(before, from, user.email, 'wrong-password-x').expect(401);
    const after = limitedApp(limits);
    await attempt(after, from, user.email, TEST_PASSWORD).expect(429);
  });

  it('starts a count over once its window has passed', async () => {
    const user = await createUser({ email: uniqueEmail('window') });
    const app = limitedApp({ perAccount: 2, perAccountAnyAddress: 100, perAddress: 100 });
    const from = freshAddress();
    for (let i = 0; i < 2; i++) await attempt(app, from, user.email, 'wrong-password-x').expect(401);
    await attempt(app, from, user.email, TEST_PASSWORD).expect(429);
    // Moves this account's windows into the past rather than waiting for them.
    await t.sequelize.query(`UPDATE rate_limits SET reset_at = now() - interval '1 second' WHERE key LIKE :key`, {
      replacements: { key: `sign-in:account%${user.email}%` },
    });
    await t.sequelize.query(`UPDATE rate_limits SET reset_at = now() - interval '1 second' WHERE key = :key`, {
      replacements: { key: `sign-in:address:${from}` },
    });
    await attempt(app, from, user.email, TEST_PASSWORD).expect(200);
  });

  it('prunes counters whose window has ended when a write opens a new window, and keeps the live ones', async () => {
    await t.sequelize.query(
      `INSERT INTO rate_limits (key, hits, reset_at) VALUES
         ('prune-test:ended-1', 7, now() - interval '1 hour'),
         ('prune-test:ended-2', 1, now() - interval '1 second'),
         ('prune-test:live', 3, now() + interval '10 minutes')`,
    );
    const keys = async () =>
      (
        await t.sequelize.query<{ key: string }>(
          `SELECT key FROM rate_limits WHERE key LIKE 'prune-test:%' ORDER BY key`,
          {
            type: QueryTypes.SELECT,
          },
        )
      ).map((row) => row.key);
    expect(await keys()).toEqual(['prune-test:ended-1', 'prune-test:ended-2', 'prune-test:live']);

    const app = limitedApp({ perAccount: 100, perAccountAnyAddress: 100, perAddress: 100 });
    const from = freshAddress();
    await attempt(app, from, uniqueEmail('pruner'), 'wrong-password-x').expect(401);
    expect(await keys()).toEqual(['prune-test:live']);
    const [{ ended }] = await t.sequelize.query<{ ended: number }>(
      `SELECT count(*)::int AS ended FROM rate_limits WHERE reset_at <= now()`,
      { type: QueryTypes.SELECT },
    );
    expect(ended).toBe(0);
    // The attempt that pruned was counted as usual.
    const [counted] = await t.sequelize.query<{ hits: number }>(`SELECT hits FROM rate_limits WHERE key = :key`, {
      replacements: { key: `sign-in:address:${from}` },
      type: QueryTypes.SELECT,
    });
    expect(counted.hits).toBe(1);
  });
});
