import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { Membership, User, Workspace } from '@api/models';
import { uniqueEmail } from './helpers/factories';
import { useTestApp } from './helpers/test-app';

const t = useTestApp();

const signUp = (body: unknown) =>
  request(t.app)
    .post('/api/auth/sign-up')
    .send(body as object);
const valid = () => ({ email: uniqueEmail('new'), name: 'Wren Calloway', password: 'tailwheel-1987' });

function cookieOf(response: request.Response): string {
  return ([] as string[]).concat(response.headers['set-cookie'] ?? [])[0] ?? '';
}

describe('POST /api/auth/sign-up', () => {
  it('creates the account, signs in, and gives the user a workspace they own', async () => {
    const body = valid();
    const response = await signUp(body).expect(201);
    expect(response.body.data.user).toMatchObject({ email: body.email, name: body.name });
    expect(response.body.data.user).not.toHaveProperty('passwordHash');
    expect(typeof response.body.data.token).toBe('string');

    const cookie = cookieOf(response);
    expect(cookie).toMatch(/^bindery_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);

    const me = await request(t.app).get('/api/me').set('Cookie', cookie.split(';')[0]).expect(200);
    expect(me.body.data.user.email).toBe(body.email);
    expect(me.body.data.workspaces).toEqual([
      { id: expect.any(String), name: "Wren Calloway's workspace", role: 'owner' },
    ]);
  });

  it('stores the e-mail in lower case and the password only as a bcrypt hash of cost 12', async () => {
    const body = { ...valid(), email: `  Mixed.Case-${Date.now()}@Test.Example ` };
    await signUp(body).expect(201);
    const user = await User.findOne({ where: { email: body.email.trim().toLowerCase() } });
    expect(user).not.toBeNull();
    expect(user!.passwordHash).toMatch(/^\$2[aby]\$12\$/);
    expect(user!.passwordHash).not.toContain(body.password);
  });

  it.each([
    ['no e-mail', { email: undefined }, 'email', /Enter your e-mail/],
    ['an empty e-mail', { email: '' }, 'email', /Enter your e-mail/],
    ['an e-mail without a domain', { email: 'pilot@' }, 'email', /valid e-mail/],
    ['no name', { name: undefined }, 'name', /Enter your name/],
    ['a name of spaces', { name: '   ' }, 'name', /Enter your name/],
    ['a 9-character password', { password: 'short-pw9' }, 'password', /at least 10/],
    ['a password past 72 bytes', { password: 'ü'.repeat(40) }, 'password', /at most 72 bytes/],
    ['a password that is a number', { password: 12345678901 }, 'password', /Choose a password/],
  ])('refuses %s with a field error and stores nothing', async (_label, change, field, message) => {
    const before = await User.count();
    const response = await signUp({ ...valid(), ...change }).expect(400);
    expect(response.body.error.code).toBe('invalid-input');
    expect(response.body.error.details.fields[field]).toMatch(message);
    expect(response.headers['set-cookie']).toBeUndefined();
    expect(await User.count()).toBe(before);
  });

  it('reports every bad field at once', async () => {
    const response = await signUp({ email: 'nope', name: '', password: 'x' }).expect(400);
    expect(Object.keys(response.body.error.details.fields).sort()).toEqual(['email', 'name', 'password']);
  });

  it('refuses an e-mail already taken, whatever its case, and leaves no half-made workspace', async () => {
    const body = valid();
    await signUp(body).expect(201);
    const [workspaces, memberships] = [await Workspace.count(), await Membership.count()];
    const response = await signUp({ ...body, email: body.email.toUpperCase(), name: 'Someone Else' }).expect(409);
    expect(response.body.error.code).toBe('email-taken');
    expect(response.body.error.details.fields.email).toMatch(/already exists/);
    expect(await Workspace.count()).toBe(workspaces);
    expect(await Membership.count()).toBe(memberships);
  });

  it('answers malformed JSON with 400 malformed-json', async () => {
    const response = await request(t.app)
      .post('/api/auth/sign-up')
      .set('Content-Type', 'application/json')
      .send('{"email": "a@b.example",')
      .expect(400);
    expect(response.body.error).toMatchObject({ code: 'malformed-json', message: expect.any(String), details: {} });
  });

  it('answers a body past the size limit with 413', async () => {
    const response = await signUp({ ...valid(), name: 'x'.repeat(700 * 1024) }).expect(413);
    expect(response.body.error.code).toBe('too-large');
  });

  it('refuses a form-encoded body with 415 and stores nothing', async () => {
    const before = await User.count();
    const response = await request(t.app)
      .post('/api/auth/sign-up')
      .type('form')
      .send('email=a%40b.example&name=A&password=long-enough-1')
      .expect(415);
    expect(response.body.error.code).toBe('unsupported-media-type');
    expect(await User.count()).toBe(before);
  });
});
