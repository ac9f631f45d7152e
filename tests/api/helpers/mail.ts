import { afterAll, beforeAll } from 'vitest';
import { createApp } from '../../../api/app';
import { startLocalMailServer, type LocalMailServer } from '../../../api/mail/local-mail-server';
import { createMailService, type MailService } from '../../../api/mail/mail-service';
import { Op } from 'sequelize';
import { OutboxMessage } from '../../../api/models';
import { useTestApp, type ConfigOverrides, type TestApp } from './test-app';

export const TEST_APP_URL = 'http://bindery.test';

export interface MailTestApp extends TestApp {
  mail: MailService;
  mailServer: LocalMailServer;
}

/**
 * Like useTestApp, with a real local mail server (smtp-server on a free loopback port)
 * whose catch lands in this file's own database, and the app sending through it.
 */
export function useMailTestApp(overrides: ConfigOverrides = {}): MailTestApp {
  const handle = useTestApp(overrides) as MailTestApp;
  beforeAll(async () => {
    handle.mailServer = await startLocalMailServer();
    handle.mail = createMailService(
      { host: handle.mailServer.host, port: handle.mailServer.port, secure: false, ignoreTLS: true, auth: null },
      { from: 'Bindery <bindery@test.example>', appUrl: TEST_APP_URL, outboxEnabled: true },
    );
    handle.app = createApp({ sequelize: handle.sequelize, config: handle.config, mail: handle.mail });
  });
  afterAll(async () => {
    handle.mail?.close();
    await handle.mailServer?.close();
  });
  return handle;
}

/** What the local mail server caught for one address, newest first. */
export function mailTo(address: string): Promise<OutboxMessage[]> {
  return OutboxMessage.findAll({
    where: { envelopeTo: { [Op.contains]: [address.toLowerCase()] } },
    order: [
      ['receivedAt', 'DESC'],
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
