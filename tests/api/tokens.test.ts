import jwt from 'jsonwebtoken';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { User } from '@api/models';
import { randomUUID } from 'node:crypto';
import { bearer, createUser, signIn, tokenFor, uniqueEmail } from './helpers/factories';
import { useTestApp } from './helpers/test-app';

const t = useTestApp();
let pilot: User;
let other: User;

beforeAll(async () => {
  pilot = await createUser({ email: uniqueEmail('token') });
  other = await createUser({ email: uniqueEmail('other') });
});

const me = (headers: Record<string, string>) => request(t.app).get('/api/me').set(headers);
const b64 = (value: object) => Buffer.from(JSON.stringify(value)).toString('base64url');
const now = () => Math.floor(Date.now() / 1000);

describe('session tokens', () => {
  it('a token made by the server is accepted', async () => {
    await me(bearer(tokenFor(pilot, t.config))).expect(200);
  });

  it('rejects a token whose payload was changed to another user', async () => {
    const [header, , signature] = tokenFor(pilot, t.config).split('.');
    const forged = [header, b64({ sv: 1, sub: other.id, iat: now(), exp: now() + 3600 }), signature].join('.');
    const response = await me(bearer(forged)).expect(401);
    expect(response.body.error.code).toBe('invalid-token');
  });

  it('rejects a token signed with another secret', async () => {
    const token = jwt.sign({ sv: 1 }, 'some-other-secret-that-is-long-enough', {
      algorithm: 'HS256',
      subject: pilot.id,
      expiresIn: 3600,
    });
    expect((await me(bearer(token)).expect(401)).body.error.code).toBe('invalid-token');
  });

  it('rejects an unsigned token (alg: none)', async () => {
    const token = `${b64({ alg: 'none', typ: 'JWT' })}.${b64({ sv: 1, sub: pilot.id, iat: now(), exp: now() + 3600 })}.`;
    expect((await me(bearer(token)).expect(401)).body.error.code).toBe('invalid-token');
  });

  it('rejects the right secret under another algorithm (HS512)', async () => {
    const token = jwt.sign({ sv: 1 }, t.config.jwtSecret, { algorithm: 'HS512', subject: pilot.id, expiresIn: 3600 });
    expect((await me(bearer(token)).expect(401)).body.error.code).toBe('invalid-token');
  });

  it('rejects an expired token with session-expired', async () => {
    const token = jwt.sign({ sv: 1, sub: pilot.id, iat: now() - 7200, exp: now() - 3600 }, t.config.jwtSecret, {
      algorithm: 'HS256',
    });
    const response = await me(bearer(token)).expect(401);
    expect(response.body.error.code).toBe('session-expired');
  });

  it('rejects a well-signed token without the session version', async () => {
    const token = jwt.sign({}, t.config.jwtSecret, { algorithm: 'HS256', subject: pilot.id, expiresIn: 3600 });
    expect((await me(bearer(token)).expect(401)).body.error.code).toBe('invalid-token');
  });

  it('rejects a well-signed token without an expiry, or without an id that sign-out could revoke', async () => {
    const forever = jwt.sign({ sv: 1, jti: randomUUID() }, t.config.jwtSecret, {
      algorithm: 'HS256',
      subject: pilot.id,
    });
    expect((await me(bearer(forever)).expect(401)).body.error.code).toBe('invalid-token');
    const anonymous = jwt.sign({ sv: 1 }, t.config.jwtSecret, {
      algorithm: 'HS256',
      subject: pilot.id,
      expiresIn: 3600,
    });
    expect((await me(bearer(anonymous)).expect(401)).body.error.code).toBe('invalid-token');
  });

  it('sign-out revokes the token it was sent with on the server; other sessions go on', async () => {
    const copied = await signIn(t.app, pilot.email);
    const elsewhere = await signIn(t.app, pilot.email);
    await me(bearer(copied.token)).expect(200);
    await request(t.app).post('/api/auth/sign-out').set('Cookie', copied.cookie).expect(200);
    // A copy of the token (stolen, or a second tab) no longer works, by header or cookie.
    expect((await me(bearer(copied.token)).expect(401)).body.error.code).toBe('session-ended');
    await me({ Cookie: copied.cookie }).expect(401);
    await me(bearer(elsewhere.token)).expect(200);
    await request(t.app).post('/api/auth/sign-out').set(bearer(elsewhere.token)).expect(200);
    await me(bearer(elsewhere.token)).expect(401);
    // Signing out twice, or with an expired or broken cookie, still just clears it.
    await request(t.app).post('/api/auth/sign-out').set('Cookie', copied.cookie).expect(200);
    await request(t.app).post('/api/auth/sign-out').set('Cookie', 'bindery_session=abc.def.ghi').expect(200);
  });

  it('rejects a token of a user who no longer exists', async () => {
    const gone = await createUser({ email: uniqueEmail('gone') });
    const token = tokenFor(gone, t.config);
    await gone.destroy();
    expect((await me(bearer(token)).expect(401)).body.error.code).toBe('session-ended');
  });

  it("rejects a token after the user's session version was raised", async () => {
    const user = await createUser({ email: uniqueEmail('version') });
    const token = tokenFor(user, t.config);
    await user.increment('sessionVersion');
    expect((await me(bearer(token)).expect(401)).body.error.code).toBe('session-ended');
  });

  it.each([
    ['garbage', 'Bearer not-a-jwt'],
    ['a Basic header', 'Basic dXNlcjpwYXNz'],
    ['an empty Bearer', 'Bearer '],
  ])('rejects an Authorization header with %s', async (_label, value) => {
    await me({ Authorization: value }).expect(401);
  });

  it('rejects a session cookie that is not a valid token', async () => {
    expect((await me({ Cookie: 'bindery_session=abc.def.ghi' }).expect(401)).body.error.code).toBe('invalid-token');
  });
});

describe('GET /api/session', () => {
  const session = (headers: Record<string, string> = {}) => request(t.app).get('/api/session').set(headers);

  it('answers signed out as 200 with no user, so a first visit logs no failed request', async () => {
    expect((await session().expect(200)).body).toEqual({ data: null });
  });

  it('answers the same for a token that is not valid, and never names who it was for', async () => {
    const [header, , signature] = tokenFor(pilot, t.config).split('.');
    const forged = [header, b64({ sv: 1, sub: other.id, iat: now(), exp: now() + 3600 }), signature].join('.');
    expect((await session(bearer(forged)).expect(200)).body).toEqual({ data: null });
  });

  it('answers the signed-in user and their workspaces as /api/me does', async () => {
    const headers = bearer(tokenFor(pilot, t.config));
    const [fromSession, fromMe] = await Promise.all([session(headers).expect(200), me(headers).expect(200)]);
    expect(fromSession.body.data.user.id).toBe(pilot.id);
    expect(fromSession.body).toEqual(fromMe.body);
  });
});
