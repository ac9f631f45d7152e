import type { Sequelize } from 'sequelize';
import { startMailDelivery, type DeliveryOptions, type MailDelivery } from './delivery';
import { startLocalMailServer } from './local-mail-server';
import { createMailer, createMailService, type MailService } from './mail-service';
import { mailSettingsFromEnv } from './mail-settings';

export interface RunningMail {
  service: MailService;
  delivery: MailDelivery;
  /** One line for the console: where mail goes. */
  description: string;
  close(): Promise<void>;
}

/**
 * The mail of a running app: queued in the outbox table and delivered by this process's
 * delivery loop, through SMTP_HOST when it is set, otherwise through a local mail
 * server started here, whose catch the Outbox screen shows.
 */
export async function startMail(
  env: NodeJS.ProcessEnv,
  fallbackAppUrl: string,
  sequelize: Sequelize,
  deliveryOptions: Partial<DeliveryOptions> = {},
): Promise<RunningMail> {
  const settings = mailSettingsFromEnv(env, fallbackAppUrl);
  if (settings.mode === 'smtp') {
    const mailer = createMailer({
      host: settings.host,
      port: settings.port,
      secure: settings.secure,
      ignoreTLS: false,
      auth: settings.user ? { user: settings.user, pass: settings.password ?? '' } : null,
    });
    const delivery = startMailDelivery(sequelize, mailer, deliveryOptions);
    return {
      service: createMailService({
        from: settings.from,
        appUrl: settings.appUrl,
        outboxEnabled: false,
        wake: () => delivery.wake(),
      }),
      delivery,
      description: `Mail goes out through ${settings.host}:${settings.port}.`,
      close: async () => {
        await delivery.stop();
        mailer.close();
      },
    };
  }
  let server;
  try {
    server = await startLocalMailServer({ port: settings.port });
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'EADDRINUSE')
      throw new Error(
        `MAIL_PORT ${settings.port} on 127.0.0.1 is already in use: stop what uses it or set MAIL_PORT to another port.`,
        { cause: error },
      );
    throw error;
  }
  const mailer = createMailer({ host: server.host, port: server.port, secure: false, ignoreTLS: true, auth: null });
  const delivery = startMailDelivery(sequelize, mailer, deliveryOptions);
  return {
    service: createMailService({
      from: settings.from,
      appUrl: settings.appUrl,
      outboxEnabled: true,
      wake: () => delivery.wake(),
    }),
    delivery,
    description: `Mail is caught by the local mail server on ${server.host}:${server.port}; read it on the Outbox screen.`,
    close: async () => {
      await delivery.stop();
      mailer.close();
      await server.close();
    },
  };
}
