import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '@api/app';
import { createMailService } from '@api/mail/mail-service';
import { DEFAULT_FROM, mailSettingsFromEnv } from '@api/mail/mail-settings';
import { Invitation, type User, type Workspace } from '@api/models';
import { bearer, createUser, createWorkspace, tokenFor, uniqueEmail } from './helpers/factories';
import { mailTo, TEST_APP_URL, useMailTestApp } from './helpers/mail';

const t = useMailTestApp();
let owner: User;
let workspace: Workspace;

beforeAll(async () => {
  owner = await createUser({ name: 'Oona Cottongrass' });
  workspace = await createWorkspace({ name: 'Heron Flats', owner });
});

const as = (user: User) => bearer(tokenFor(user, t.config));

describe('the outbox of the local mail server', () => {
  it('lists what the local mail server caught for the caller’s own address, newest first, with text, HTML and the links', async () => {
    const first = await createUser({ email: uniqueEmail('first') });
    const second = await createUser({ email: uniqueEmail('second') });
    await request(t.app)
      .post(`/api/workspaces/${workspace.id}/invitations`)
      .set(as(owner))
      .send({ email: first.email, role: 'viewer' })
      .expect(201);
    const other = await createWorkspace({ name: 'Marsh End', owner });
    await request(t.app)
      .post(`/api/workspaces/${other.id}/invitations`)
      .set(as(owner))
      .send({ email: first.email, role: 'editor' })
      .expect(201);
    await request(t.app)
      .post(`/api/workspaces/${workspace.id}/invitations`)
      .set(as(owner))
      .send({ email: second.email, role: 'editor' })
      .expect(201);
    await mailTo(first.email);

    const response = await request(t.app).get('/api/outbox').set(as(first)).expect(200);
    expect(response.body.data.map((mail: { to: string[] }) => mail.to)).toEqual([[first.email], [first.email]]);
    const [newest] = response.body.data;
    expect(newest).toMatchObject({
      from: 'Bindery <bindery@test.example>',
      subject: 'Oona Cottongrass invites you to Marsh End on Bindery',
      state: 'delivered',
    });
    expect(newest.text).toContain('as an editor');
    expect(newest.html).toContain('<a href="http://bindery.test/invitations/');
    expect(newest.links).toHaveLength(1);
    expect(newest.links[0]).toMatch(new RegExp(`^${TEST_APP_URL}/invitations/[\\w.-]+$`));
    expect(Date.parse(newest.received_at)).not.toBeNaN();
    expect(response.body.pagination).toMatchObject({ limit: 50, offset: 0, total: 2 });

    // The owner sent them, but they are not the owner's mail.
    expect((await request(t.app).get('/api/outbox').set(as(owner)).expect(200)).body.data).toEqual([]);
  });

  it('an outsider cannot read another account’s reset link (the account takeover of issue 12)', async () => {
    const victim = await createUser({ email: uniqueEmail('victim') });
    const signUp = await request(t.app)
      .post('/api/auth/sign-up')
      .send({ email: uniqueEmail('stranger'), name: 'Stranger', password: 'a-long-enough-password' })
      .expect(201);
    await request(t.app).post('/api/auth/password-reset').send({ email: victim.email }).expect(202);
    expect(await mailTo(victim.email)).toHaveLength(1);

    const theirs = await request(t.app).get('/api/outbox').set(bearer(signUp.body.data.token)).expect(200);
    expect(theirs.body.data).toEqual([]);
    const asked = await request(t.app)
      .get(`/api/outbox?to=${encodeURIComponent(victim.email)}`)
      .set(bearer(signUp.body.data.token))
      .expect(400);
    expect(asked.body.error.details.fields.to).toBe('This field is not known here.');

    const own = await request(t.app).get('/api/outbox').set(as(victim)).expect(200);
    expect(own.body.data.map((mail: { subject: string }) => mail.subject)).toEqual(['Choose a new Bindery password']);
  });

  it('needs a signed-in caller', async () => {
    await request(t.app).get('/api/outbox').expect(401);
  });

  it('refuses bad paging', async () => {
    const response = await request(t.app).get('/api/outbox?limit=0').set(as(owner)).expect(400);
    expect(response.body.error.details.fields.limit).toBeDefined();
  });

  it('does not exist when mail goes to a real SMTP host, or when there is no mail at all', async () => {
    const smtp = createMailService({ from: DEFAULT_FROM, appUrl: TEST_APP_URL, outboxEnabled: false, wake: () => {} });
    const production = createApp({ sequelize: t.sequelize, config: t.config, mail: smtp });
    expect((await request(production).get('/api/outbox').set(as(owner)).expect(404)).body.error.code).toBe(
      'no-such-route',
    );
    const mailless = createApp({ sequelize: t.sequelize, config: t.config });
    await request(mailless).get('/api/outbox').set(as(owner)).expect(404);
  });

  it('a server without mail refuses to invite (503) and keeps nothing', async () => {
    const mailless = createApp({ sequelize: t.sequelize, config: t.config });
    const email = uniqueEmail('unsent');
    const response = await request(mailless)
      .post(`/api/workspaces/${workspace.id}/invitations`)
      .set(as(owner))
      .send({ email, role: 'viewer' })
      .expect(503);
    expect(response.body.error.code).toBe('mail-not-configured');
    expect(await Invitation.count({ where: { email } })).toBe(0);
  });
});

describe('mail settings from the environment', () => {
  it('without SMTP_HOST: the local mail server, on MAIL_PORT when given', () => {
    expect(mailSettingsFromEnv({}, 'http://127.0.0.1:3000')).toEqual({
      mode: 'local',
      port: null,
      from: DEFAULT_FROM,
      appUrl: 'http://127.0.0.1:3000',
    });
    expect(
      mailSettingsFromEnv({ MAIL_PORT: '2525', APP_URL: 'https://bindery.example.org/' }, 'http://127.0.0.1:3000'),
    ).toMatchObject({ mode: 'local', port: 2525, appUrl: 'https://bindery.example.org' });
  });

  it('with SMTP_HOST: that server, TLS on 465, STARTTLS otherwise, credentials and sender', () => {
    const env = {
      SMTP_HOST: 'smtp.example.org',
      SMTP_USER: 'bindery',
      SMTP_PASSWORD: 'secret',
      MAIL_FROM: 'Club <club@example.org>',
      APP_URL: 'https://bindery.example.org',
    };
    expect(mailSettingsFromEnv(env, 'http://127.0.0.1:3000')).toEqual({
      mode: 'smtp',
      host: 'smtp.example.org',
      port: 587,
      secure: false,
      user: 'bindery',
      password: 'secret',
      from: 'Club <club@example.org>',
      appUrl: 'https://bindery.example.org',
    });
    expect(mailSettingsFromEnv({ ...env, SMTP_PORT: '465' }, 'x')).toMatchObject({ port: 465, secure: true });
    expect(mailSettingsFromEnv({ ...env, SMTP_PORT: '2587', SMTP_SECURE: 'true' }, 'x')).toMatchObject({
      port: 2587,
      secure: true,
    });
  });

  it('refuses settings that cannot work, with the variable named', () => {
    expect(() => mailSettingsFromEnv({ MAIL_PORT: 'twenty' }, 'http://127.0.0.1:3000')).toThrow(/MAIL_PORT/);
    expect(() =>
      mailSettingsFromEnv({ SMTP_HOST: 'smtp.example.org', SMTP_PORT: '70000' }, 'http://127.0.0.1:3000'),
    ).toThrow(/SMTP_PORT/);
    expect(() => mailSettingsFromEnv({ APP_URL: 'bindery.example.org' }, 'http://127.0.0.1:3000')).toThrow(/APP_URL/);
  });
});
