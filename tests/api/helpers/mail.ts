import { afterAll, beforeAll } from 'vitest';
import type { Sequelize } from 'sequelize';
import { Op } from 'sequelize';
import { createApp } from '@api/app';
import type { DeliveryOptions } from '@api/mail/delivery';
import { startMail, type RunningMail } from '@api/mail/start-mail';
import { OutboxMessage } from '@api/models';
import { useTestApp, type ConfigOverrides, type TestApp } from './test-app';

export const TEST_APP_URL = 'http://bindery.test';
export const TEST_FROM = 'Bindery <bindery@test.example>';

export interface MailTestApp extends TestApp {
  mail: RunningMail;
}

// The delivery loop of the file's app, so `mailTo` can let it finish first.
let current: RunningMail | null = null;

/**
 * The mail of a running app as `npm start` wires it (queue, delivery loop, local mail
 * server on a free loopback port), on the given database.
 */
export async function startTestMail(sequelize: Sequelize, delivery: Partial<DeliveryOptions> = {}) {
  const mail = await startMail({ APP_URL: TEST_APP_URL, MAIL_FROM: TEST_FROM }, TEST_APP_URL, sequelize, {
    pollMs: 200,
    ...delivery,
  });
  current = mail;
  return mail;
}

/** Like useTestApp, with the app's mail queued, delivered and caught by a real local mail server. */
export function useMailTestApp(overrides: ConfigOverrides = {}): MailTestApp {
  const handle = useTestApp(overrides) as MailTestApp;
  beforeAll(async () => {
    handle.mail = await startTestMail(handle.sequelize);
    handle.app = createApp({ sequelize: handle.sequelize, config: handle.config, mail: handle.mail.service });
  });
  afterAll(async () => {
    await handle.mail?.close();
  });
  return handle;
}

/**
 * What the local mail server caught for one address, newest first, once every message
 * due has gone through SMTP.
 */
export async function mailTo(address: string): Promise<OutboxMessage[]> {
  await current?.delivery.drain();
  return OutboxMessage.findAll({
    where: { envelopeTo: { [Op.contains]: [address.toLowerCase()] }, receivedAt: { [Op.ne]: null } },
    order: [
      ['queuedAt', 'DESC'],
      ['id', 'DESC'],
    ],
  });
}

/** The token of the app link `/<prefix>/<token>` in a mail's text. */
export function linkToken(message: OutboxMessage, prefix: 'invitations' | 'reset-password'): string {
  const match = new RegExp(`${TEST_APP_URL.replace(/\./g, '\\.')}/${prefix}/([A-Za-z0-9._-]+)`).exec(message.textBody);
  if (!match) throw new Error(`No /${prefix}/ link in the mail "${message.subject}":\n${message.textBody}`);
  return match[1];
}
