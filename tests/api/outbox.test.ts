import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../api/app';
import { createMailService } from '../../api/mail/mail-service';
import { DEFAULT_FROM, mailSettingsFromEnv } from '../../api/mail/mail-settings';
import { Invitation, type User, type Workspace } from '../../api/models';
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
  it('lists what the local mail server caught, newest first, with text, HTML and the links', async () => {
    const first = uniqueEmail('first');
    const second = uniqueEmail('second');
    await request(t.app)
      .post(`/api/workspaces/${workspace.id}/invitations`)
      .set(as(owner))
      .send({ email: first, role: 'viewer' })
      .expect(201);
    await request(t.app)
      .post(`/api/workspaces/${workspace.id}/invitations`)
      .set(as(owner))
      .send({ email: second, role: 'editor' })
      .expect(201);

    const response = await request(t.app).get('/api/outbox').set(as(owner)).expect(200);
    const ours = response.body.data.filter(
      (mail: { to: string[] }) => mail.to.includes(first) || mail.to.includes(second),
    );
    expect(ours.map((mail: { to: string[] }) => mail.to)).toEqual([[second], [first]]);
    const [newest] = ours;
    expect(newest).toMatchObject({
      from: 'Bindery <bindery@test.example>',
      subject: 'Oona Cottongrass invites you to Heron Flats on Bindery',
    });
    expect(newest.text).toContain('as an editor');
    expect(newest.html).toContain('<a href="http://bindery.test/invitations/');
    expect(newest.links).toHaveLength(1);
    expect(newest.links[0]).toMatch(new RegExp(`^${TEST_APP_URL}/invitations/[\\w.-]+$`));
    expect(Date.parse(newest.received_at)).not.toBeNaN();
    expect(response.body.pagination).toMatchObject({ limit: 50, offset: 0 });

    const filtered = await request(t.app)
      .get(`/api/outbox?to=${encodeURIComponent(first.toUpperCase())}`)
      .set(as(owner))
      .expect(200);
    expect(filtered.body.data).toHaveLength(1);
    expect(filtered.body.data[0].to).toEqual([first]);
  });

  it('needs a signed-in caller', async () => {
    await request(t.app).get('/api/outbox').expect(401);
  });

  it('refuses bad paging', async () => {
    const response = await request(t.app).get('/api/outbox?limit=0').set(as(owner)).expect(400);
    expect(response.body.error.details.fields.limit).toBeDefined();
  });

  it('does not exist when mail goes to a real SMTP host, or when there is no mail at all', async () => {
    const smtp = createMailService(
      { host: '127.0.0.1', port: 9, secure: false, ignoreTLS: true, auth: null },
      { from: DEFAULT_FROM, appUrl: TEST_APP_URL, outboxEnabled: false },
    );
    const production = createApp({ sequelize: t.sequelize, config: t.config, mail: smtp });
    expect((await request(production).get('/api/outbox').set(as(owner)).expect(404)).body.error.code).toBe(
      'no-such-route',
    );
    smtp.close();
    const mailless = createApp({ sequelize: t.sequelize, config: t.config });
    await request(mailless).get('/api/outbox').set(as(owner)).expect(404);
  });

  it('an invitation that cannot be mailed is not kept (503)', async () => {
    const mailless = createApp({ sequelize: t.sequelize, config: t.config });
    const email = uniqueEmail('unsent');
    const response = await request(mailless)
      .post(`/api/workspaces/${workspace.id}/invitations`)
      .set(as(owner))
      .send({ email, role: 'viewer' })
      .expect(503);
    expect(response.body.error.code).toBe('mail-not-configured');

    // A mail server that refuses connections: the send fails inside the transaction.
    const unreachable = createMailService(
      { host: '127.0.0.1', port: 9, secure: false, ignoreTLS: true, auth: null },
      { from: DEFAULT_FROM, appUrl: TEST_APP_URL, outboxEnabled: false },
    );
    const broken = createApp({ sequelize: t.sequelize, config: t.config, mail: unreachable });
    const failed = await request(broken)
      .post(`/api/workspaces/${workspace.id}/invitations`)
      .set(as(owner))
      .send({ email, role: 'viewer' })
      .expect(503);
    expect(failed.body.error.code).toBe('mail-unavailable');
    unreachable.close();
    expect(await Invitation.count({ where: { email } })).toBe(0);
    expect(await mailTo(email)).toHaveLength(0);
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
