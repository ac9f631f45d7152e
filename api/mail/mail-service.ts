import nodemailer, { type Transporter } from 'nodemailer';
import { ServiceUnavailable } from '../errors';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

/** How the API sends mail; routes reach it through `mailFor(context)`. */
export interface MailService {
  send(mail: OutgoingMail): Promise<void>;
  /** The app's public address, for links in mails (no trailing slash). */
  readonly appUrl: string;
  /** True while a local mail server catches the mail into the outbox (development, demo). */
  readonly outboxEnabled: boolean;
  close(): void;
}

export interface TransportOptions {
  host: string;
  port: number;
  secure: boolean;
  /** The local mail server speaks plain SMTP on loopback; a real host may offer STARTTLS. */
  ignoreTLS: boolean;
  auth: { user: string; pass: string } | null;
}

export function createMailService(
  transport: TransportOptions,
  settings: { from: string; appUrl: string; outboxEnabled: boolean },
): MailService {
  const transporter: Transporter = nodemailer.createTransport({
    host: transport.host,
    port: transport.port,
    secure: transport.secure,
    ignoreTLS: transport.ignoreTLS,
    ...(transport.auth ? { auth: transport.auth } : {}),
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 20_000,
  });
  return {
    appUrl: settings.appUrl,
    outboxEnabled: settings.outboxEnabled,
    async send(mail) {
      try {
        await transporter.sendMail({
          from: settings.from,
          to: mail.to,
          subject: mail.subject,
          text: mail.text,
          html: mail.html,
        });
      } catch (error) {
        console.error('[mail-failed]', error instanceof Error ? error.message : error);
        throw new ServiceUnavailable(
          'The e-mail could not be sent just now, so nothing was changed. Try again shortly.',
          { code: 'mail-unavailable' },
        );
      }
    },
    close: () => transporter.close(),
  };
}
