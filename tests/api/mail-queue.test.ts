import type { Express } from 'express';
import { QueryTypes, type Sequelize } from 'sequelize';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '@api/app';
import { createSequelize } from '@api/db/sequelize';
import { backoffAfter, startMailDelivery, type DeliveryOptions } from '@api/mail/delivery';
import { startLocalMailServer, type LocalMailServer } from '@api/mail/local-mail-server';
import { createMailer, createMailService, type Mailer } from '@api/mail/mail-service';
import { Invitation, OutboxMessage, type User, type Workspace } from '@api/models';
import { bearer, createUser, createWorkspace, tokenFor, uniqueEmail } from './helpers/factories';
import { TEST_APP_URL, TEST_FROM } from './helpers/mail';
import { useTestApp } from './helpers/test-app';

// The outbox as a queue, with the delivery loops under the test's control: the app here
// only queues (its wake-up does nothing), and each test starts the loops it needs, as
// separate processes would, against a real local mail server.

const t = useTestApp();
let mailServer: LocalMailServer;
let app: Express;
let owner: User;
let workspace: Workspace;
let secondProcess: Sequelize;
const stoppers: (() => Promise<void> | void)[] = [];

beforeAll(async () => {
  mailServer = await startLocalMailServer();
  const service = createMailService({ from: TEST_FROM, appUrl: TEST_APP_URL, outboxEnabled: true, wake: () => {} });
  app = createApp({ sequelize: t.sequelize, config: t.config, mail: service });
  owner = await createUser({ name: 'Quilla Fenmore' });
  workspace = await createWorkspace({ name: 'Saltings Field', owner });
  secondProcess = createSequelize(t.database.url);
});

afterAll(async () => {
  for (const stop of stoppers.reverse()) await stop();
  await secondProcess?.close();
  await mailServer?.close();
});

const QUIET: Partial<DeliveryOptions> = { pollMs: 3_600_000 };

function localMailer(sent: string[] = []): Mailer {
  const mailer = createMailer({
    host: mailServer.host,
    port: mailServer.port,
    secure: false,
    ignoreTLS: true,
    auth: null,
  });
  stoppers.push(() => mailer.close());
  // Counts what really went over SMTP, to see that no message is sent twice.
  return {
    send: async (message) => (await mailer.send(message), void sent.push(message.messageId)),
    close: () => mailer.close(),
  };
}

function unreachableMailer(): Mailer {
  // Port 9 (discard) has no listener on loopback: every connection is refused.
  const mailer = createMailer({ host: '127.0.0.1', port: 9, secure: false, ignoreTLS: true, auth: null });
  stoppers.push(() => mailer.close());
  return mailer;
}

function delivery(sequelize: Sequelize, mailer: Mailer, options: Partial<DeliveryOptions> = {}) {
  const loop = startMailDelivery(sequelize, mailer, { ...QUIET, ...options });
  stoppers.push(() => loop.stop());
  return loop;
}

const pendingRows = () => OutboxMessage.findAll({ where: { state: 'pending' } });

describe('mail is queued in the transaction and delivered after commit', () => {
  it('12 parallel password resets and 12 parallel invitations all answer at once, none with 5xx; two processes deliver each message exactly once', async () => {
    // Drain whatever an earlier test left, so the counts below are this test's own.
    await delivery(t.sequelize, localMailer()).drain();
    const pilots = await Promise.all(Array.from({ length: 12 }, (_, i) => createUser({ email: uniqueEmail(`p${i}`) })));
    const invitees = Array.from({ length: 12 }, (_, i) => uniqueEmail(`invitee${i}`));
    const answers = await Promise.all([
      ...pilots.map((pilot) => request(app).post('/api/auth/password-reset').send({ email: pilot.email })),
      ...invitees.map((email) =>
        request(app)
          .post(`/api/workspaces/${workspace.id}/invitations`)
          .set(bearer(tokenFor(owner, t.config)))
          .send({ email, role: 'viewer' }),
      ),
    ]);
    expect(answers.map((answer) => answer.status)).toEqual([...Array(12).fill(202), ...Array(12).fill(201)]);
    // The invitations' mail is queued with them; each reset request waits as one row
    // until a delivery round finds whether an account has the address.
    expect(await pendingRows()).toHaveLength(12);
    const [{ requests }] = await t.sequelize.query<{ requests: number }>(
      'SELECT count(*)::int AS requests FROM password_reset_requests',
      { type: QueryTypes.SELECT },
    );
    expect(requests).toBe(12);

    const sent: string[] = [];
    const results = await Promise.all([
      delivery(t.sequelize, localMailer(sent), { batch: 3 }).drain(),
      delivery(secondProcess, localMailer(sent), { batch: 3 }).drain(),
    ]);
    expect(results.reduce((sum, result) => sum + result.delivered, 0)).toBe(24);
    expect(sent).toHaveLength(24);
    expect(new Set(sent).size).toBe(24);

    for (const address of [...pilots.map((pilot) => pilot.email), ...invitees]) {
      const [caught] = await OutboxMessage.findAll({ where: { envelopeTo: [address] } });
      expect(caught, address).toMatchObject({ state: 'delivered', attempts: 1, nextAttemptAt: null });
      expect(caught.receivedAt, `${address} was caught by the local mail server`).toBeInstanceOf(Date);
      expect(caught.textBody).toMatch(/http:\/\/bindery\.test\/(reset-password|invitations)\//);
    }
    expect(await Invitation.count({ where: { email: invitees } })).toBe(12);
  });

  it('a mail server that is away: the invitation is kept, the mail retried with growing waits, then delivered', async () => {
    await delivery(t.sequelize, localMailer()).drain();
    const email = uniqueEmail('patient');
    await request(app)
      .post(`/api/workspaces/${workspace.id}/invitations`)
      .set(bearer(tokenFor(owner, t.config)))
      .send({ email, role: 'viewer' })
      .expect(201);

    const away = delivery(t.sequelize, unreachableMailer(), { backoffMs: 60_000 });
    expect(await away.drain()).toEqual({ delivered: 0, retrying: 1, failed: 0 });
    const [waiting] = await OutboxMessage.findAll({ where: { envelopeTo: [email] } });
    expect(waiting).toMatchObject({ state: 'pending', attempts: 1, receivedAt: null });
    expect(waiting.lastError).toMatch(/ECONNREFUSED|connect/i);
    const wait = waiting.nextAttemptAt!.getTime() - Date.now();
    expect(wait).toBeGreaterThan(50_000);
    expect(wait).toBeLessThanOrEqual(60_000);
    // Not due yet, so a working process leaves it alone...
    expect((await delivery(secondProcess, localMailer()).drain()).delivered).toBe(0);

    // ...until its time comes.
    await waiting.update({ nextAttemptAt: new Date(Date.now() - 1000) });
    expect((await delivery(secondProcess, localMailer()).drain()).delivered).toBe(1);
    await waiting.reload();
    expect(waiting).toMatchObject({ state: 'delivered', attempts: 2 });
    expect(waiting.receivedAt).toBeInstanceOf(Date);
  });

  it('gives up after the last attempt and marks the message failed', async () => {
    await delivery(t.sequelize, localMailer()).drain();
    const email = uniqueEmail('lost');
    await request(app)
      .post(`/api/workspaces/${workspace.id}/invitations`)
      .set(bearer(tokenFor(owner, t.config)))
      .send({ email, role: 'viewer' })
      .expect(201);
    const away = delivery(t.sequelize, unreachableMailer(), { backoffMs: 0, maxAttempts: 3 });
    expect(await away.drain()).toEqual({ delivered: 0, retrying: 2, failed: 1 });
    const [lost] = await OutboxMessage.findAll({ where: { envelopeTo: [email] } });
    expect(lost).toMatchObject({ state: 'failed', attempts: 3, nextAttemptAt: null });
    expect((await delivery(t.sequelize, localMailer()).drain()).delivered).toBe(0);
  });

  it('waits twice as long after each failure, up to a ceiling', () => {
    const options = { backoffMs: 2_000, maxBackoffMs: 60_000 };
    expect([1, 2, 3, 4, 5, 6, 7].map((attempts) => backoffAfter(attempts, options))).toEqual([
      2_000, 4_000, 8_000, 16_000, 32_000, 60_000, 60_000,
    ]);
  });
});
