import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import type { User } from '../../api/models';
import { createUser, TEST_PASSWORD, uniqueEmail } from './helpers/factories';
import { useTestApp } from './helpers/test-app';

const t = useTestApp();
let alice: User;
let bruno: User;

beforeAll(async () => {
  alice = await createUser({ email: uniqueEmail('alice') });
  bruno = await createUser({ email: uniqueEmail('bruno') });
});

// Each test builds its own app so the limiters' counters start at zero.
const limitedApp = (perAccount: number, perAddress: number) =>
  t.appWith({ signInLimits: { windowMs: 60_000, perAccount, perAddress } }).app;
const attempt = (app: Parameters<typeof request>[0], email: string, password: string) =>
  request(app).post('/api/auth/sign-in').send({ email, password });

describe('sign-in rate limits', () => {
  it('locks one account after its allowed failures, even for the right password', async () => {
    const app = limitedApp(3, 100);
    for (let i = 0; i < 3; i++) await attempt(app, alice.email, 'wrong-password-x').expect(401);
    const blocked = await attempt(app, alice.email, TEST_PASSWORD).expect(429);
    expect(blocked.body.error.code).toBe('rate-limited');
    expect(blocked.body.error.details.retry_after_seconds).toBeGreaterThan(0);
    expect(blocked.headers['ratelimit']).toBeDefined();
    // The e-mail is the key whatever its spelling.
    await attempt(app, alice.email.toUpperCase(), TEST_PASSWORD).expect(429);
    await attempt(app, bruno.email, TEST_PASSWORD).expect(200);
  });

  it('limits one address trying many accounts', async () => {
    const app = limitedApp(100, 4);
    for (let i = 0; i < 4; i++) await attempt(app, uniqueEmail('guess'), 'wrong-password-x').expect(401);
    const blocked = await attempt(app, bruno.email, TEST_PASSWORD).expect(429);
    expect(blocked.body.error.code).toBe('rate-limited');
  });

  it('does not count successful sign-ins', async () => {
    const app = limitedApp(2, 2);
    for (let i = 0; i < 4; i++) await attempt(app, alice.email, TEST_PASSWORD).expect(200);
  });
});
