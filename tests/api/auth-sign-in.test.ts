import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import type { User } from '@api/models';
import { bearer, createUser, signIn, TEST_PASSWORD, uniqueEmail } from './helpers/factories';
import { useTestApp } from './helpers/test-app';

const t = useTestApp();
let pilot: User;

beforeAll(async () => {
  pilot = await createUser({ email: uniqueEmail('signin'), name: 'Signe Inman' });
});

const signInWith = (body: object) => request(t.app).post('/api/auth/sign-in').send(body);

describe('POST /api/auth/sign-in', () => {
  it('answers the user and a token, and sets an httpOnly SameSite=Lax session cookie', async () => {
    const response = await signInWith({ email: pilot.email, password: TEST_PASSWORD }).expect(200);
    expect(response.body.data.user).toEqual({
      id: pilot.id,
      email: pilot.email,
      name: 'Signe Inman',
      created_at: expect.any(String),
    });
    expect(response.body.data.token.split('.')).toHaveLength(3);
    const cookie = ([] as string[]).concat(response.headers['set-cookie'] ?? [])[0];
    expect(cookie).toMatch(/^bindery_session=[^;]+;/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).toMatch(/Max-Age=604800/);
  });

  it('accepts the e-mail in any case and with spaces around it', async () => {
    await signInWith({ email: `  ${pilot.email.toUpperCase()} `, password: TEST_PASSWORD }).expect(200);
  });

  it('answers a wrong password with 401 and no cookie', async () => {
    const response = await signInWith({ email: pilot.email, password: 'not-the-password' }).expect(401);
    expect(response.body.error.code).toBe('invalid-credentials');
    expect(response.headers['set-cookie']).toBeUndefined();
  });

  it('answers an unknown e-mail exactly like a wrong password', async () => {
    const unknown = await signInWith({ email: uniqueEmail('nobody'), password: 'not-the-password' }).expect(401);
    const wrong = await signInWith({ email: pilot.email, password: 'not-the-password' }).expect(401);
    expect(unknown.body).toEqual(wrong.body);
  });

  it('asks for missing fields', async () => {
    const response = await signInWith({}).expect(400);
    expect(response.body.error.details.fields).toEqual({
      email: expect.stringMatching(/e-mail/),
      password: expect.stringMatching(/password/),
    });
  });
});

describe('using the session', () => {
  it('works with the cookie and with a Bearer token', async () => {
    const { token, cookie } = await signIn(t.app, pilot.email);
    const byCookie = await request(t.app).get('/api/me').set('Cookie', cookie).expect(200);
    const byBearer = await request(t.app).get('/api/me').set(bearer(token)).expect(200);
    expect(byCookie.body).toEqual(byBearer.body);
    expect(byCookie.body.data.user.id).toBe(pilot.id);
  });

  it('GET /api/me without a session is 401', async () => {
    const response = await request(t.app).get('/api/me').expect(401);
    expect(response.body.error.code).toBe('unauthorized');
  });

  it('sign-out clears the cookie', async () => {
    const { cookie } = await signIn(t.app, pilot.email);
    const response = await request(t.app).post('/api/auth/sign-out').set('Cookie', cookie).expect(200);
    const cleared = ([] as string[]).concat(response.headers['set-cookie'] ?? [])[0];
    expect(cleared).toMatch(/^bindery_session=;/);
    expect(cleared).toMatch(/Expires=Thu, 01 Jan 1970/);
  });

  it('sign-out-everywhere ends every token issued before it', async () => {
    const user = await createUser({ email: uniqueEmail('everywhere') });
    const first = await signIn(t.app, user.email);
    const second = await signIn(t.app, user.email);
    await request(t.app).post('/api/auth/sign-out-everywhere').set(bearer(first.token)).expect(200);
    for (const token of [first.token, second.token]) {
      const response = await request(t.app).get('/api/me').set(bearer(token)).expect(401);
      expect(response.body.error.code).toBe('session-ended');
    }
    const fresh = await signIn(t.app, user.email);
    await request(t.app).get('/api/me').set(bearer(fresh.token)).expect(200);
  });
});
