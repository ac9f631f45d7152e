import jwt from 'jsonwebtoken';
import request from 'supertest';
import { beforeEach, describe, expect, it } from 'vitest';
import { PasswordReset, type User } from '@api/models';
import { bearer, createUser, signIn, TEST_PASSWORD, uniqueEmail } from './helpers/factories';
import { linkToken, mailTo, useMailTestApp } from './helpers/mail';

const t = useMailTestApp();
const NEW_PASSWORD = 'crosswind-landing-12';
let pilot: User;

beforeEach(async () => {
  pilot = await createUser({ email: uniqueEmail('forgetful'), name: 'Florence Reedling' });
});

const ask = (email: string) => request(t.app).post('/api/auth/password-reset').send({ email });

async function resetToken(user: User): Promise<string> {
  await ask(user.email).expect(202);
  const [mail] = await mailTo(user.email);
  return linkToken(mail, 'reset-password');
}

describe('password reset by e-mail', () => {
  it('answers 202 with the same words whether or not the address has an account, and mails only an account', async () => {
    const known = await ask(pilot.email.toUpperCase()).expect(202);
    const unknownEmail = uniqueEmail('nobody');
    const unknown = await ask(unknownEmail).expect(202);
    expect(unknown.body).toEqual(known.body);
    expect(known.body.data.message).toMatch(/If an account uses that address/);

    const mails = await mailTo(pilot.email);
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toBe('Choose a new Bindery password');
    expect(mails[0].textBody).toContain('Hello Florence Reedling');
    expect(mails[0].htmlBody).toContain('Choose a new password');
    expect(await mailTo(unknownEmail)).toHaveLength(0);
  });

  it('sets the new password and ends every session signed in before (old token 401)', async () => {
    const before = await signIn(t.app, pilot.email);
    await request(t.app).get('/api/me').set(bearer(before.token)).expect(200);

    const token = await resetToken(pilot);
    expect((await request(t.app).get(`/api/auth/password-reset/${token}`).expect(200)).body.data.email).toBe(
      pilot.email,
    );
    const reset = await request(t.app)
      .post(`/api/auth/password-reset/${token}`)
      .send({ password: NEW_PASSWORD })
      .expect(200);
    expect(String(reset.headers['set-cookie'])).toMatch(/bindery_session=/);

    const old = await request(t.app).get('/api/me').set(bearer(before.token)).expect(401);
    expect(old.body.error.code).toBe('session-ended');
    await request(t.app).get('/api/me').set('Cookie', before.cookie).expect(401);
    await request(t.app).get('/api/me').set(bearer(reset.body.data.token)).expect(200);

    await request(t.app).post('/api/auth/sign-in').send({ email: pilot.email, password: TEST_PASSWORD }).expect(401);
    await signIn(t.app, pilot.email, NEW_PASSWORD);
  });

  it('a link mailed before the password was changed stops working after the change', async () => {
    const token = await resetToken(pilot);
    const session = await signIn(t.app, pilot.email);
    await request(t.app)
      .post('/api/auth/password')
      .set(bearer(session.token))
      .send({ current: TEST_PASSWORD, password: NEW_PASSWORD })
      .expect(200);
    const old = await request(t.app)
      .post(`/api/auth/password-reset/${token}`)
      .send({ password: 'another-password-9' })
      .expect(410);
    expect(old.body.error.code).toBe('token-used');
    await signIn(t.app, pilot.email, NEW_PASSWORD);
  });

  it('a link works once, and using one closes the account’s other open links', async () => {
    const first = await resetToken(pilot);
    const second = await resetToken(pilot);
    await request(t.app).post(`/api/auth/password-reset/${first}`).send({ password: NEW_PASSWORD }).expect(200);
    const reused = await request(t.app)
      .post(`/api/auth/password-reset/${first}`)
      .send({ password: 'another-password-9' })
      .expect(410);
    expect(reused.body.error.code).toBe('token-used');
    expect(
      (
        await request(t.app)
          .post(`/api/auth/password-reset/${second}`)
          .send({ password: 'another-password-9' })
          .expect(410)
      ).body.error.code,
    ).toBe('token-used');
    await signIn(t.app, pilot.email, NEW_PASSWORD);
  });

  it('refuses an expired link, by the token and by the stored expiry, and changes nothing', async () => {
    const token = await resetToken(pilot);
    const { jti } = jwt.decode(token) as { jti: string };
    const now = Math.floor(Date.now() / 1000);
    const expired = jwt.sign({ exp: now - 1, iat: now - 3600 }, t.config.jwtSecret, {
      algorithm: 'HS256',
      audience: 'bindery:password-reset',
      jwtid: jti,
    });
    expect(
      (await request(t.app).post(`/api/auth/password-reset/${expired}`).send({ password: NEW_PASSWORD }).expect(401))
        .body.error.code,
    ).toBe('token-expired');

    await PasswordReset.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { id: jti } });
    expect(
      (await request(t.app).post(`/api/auth/password-reset/${token}`).send({ password: NEW_PASSWORD }).expect(401)).body
        .error.code,
    ).toBe('token-expired');
    await signIn(t.app, pilot.email, TEST_PASSWORD);
  });

  it('refuses a weak password with a field error and leaves the link usable', async () => {
    const token = await resetToken(pilot);
    const weak = await request(t.app).post(`/api/auth/password-reset/${token}`).send({ password: 'short' }).expect(400);
    expect(weak.body.error.details.fields.password).toMatch(/at least 10/);
    await signIn(t.app, pilot.email, TEST_PASSWORD);
    await request(t.app).post(`/api/auth/password-reset/${token}`).send({ password: NEW_PASSWORD }).expect(200);
  });

  it('refuses a tampered link or an invitation token', async () => {
    const token = await resetToken(pilot);
    const { jti } = jwt.decode(token) as { jti: string };
    const invitationKind = jwt.sign({}, t.config.jwtSecret, {
      algorithm: 'HS256',
      audience: 'bindery:invitation',
      jwtid: jti,
      expiresIn: 600,
    });
    expect(
      (
        await request(t.app)
          .post(`/api/auth/password-reset/${invitationKind}`)
          .send({ password: NEW_PASSWORD })
          .expect(401)
      ).body.error.code,
    ).toBe('invalid-token');
    const forged = jwt.sign({}, 'a-different-secret-that-is-long-enough!!', {
      algorithm: 'HS256',
      audience: 'bindery:password-reset',
      jwtid: jti,
      expiresIn: 600,
    });
    expect(
      (await request(t.app).post(`/api/auth/password-reset/${forged}`).send({ password: NEW_PASSWORD }).expect(401))
        .body.error.code,
    ).toBe('invalid-token');
  });

  it('refuses a request without a valid address (400) and sends nothing', async () => {
    const response = await request(t.app)
      .post('/api/auth/password-reset')
      .send({ email: 'pilot at field' })
      .expect(400);
    expect(response.body.error.details.fields.email).toBeDefined();
  });

  it('limits how many reset mails one address can ask for (429)', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 6; i += 1) statuses.push((await ask(pilot.email)).status);
    expect(statuses).toEqual([202, 202, 202, 202, 202, 429]);
    expect(await mailTo(pilot.email)).toHaveLength(5);
  });
});
