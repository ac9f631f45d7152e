import { randomUUID } from 'node:crypto';
import nodemailer, { type Transporter } from 'nodemailer';
import type { Transaction } from 'sequelize';
import { OutboxMessage } from '../models';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

/**
 * How the API sends mail; routes reach it through `mailFor(context)`. Nothing here talks
 * SMTP: a command queues its mail in its own transaction (so mail and change commit
 * together), and the delivery loop sends it after commit.
 */
export interface MailService {
  queue(mail: OutgoingMail, transaction: Transaction): Promise<void>;
  /** Wakes this process's delivery loop; for rows written by hand (see reset-password). */
  deliverSoon(): void;
  /** The sender, as the From header of every mail. */
  readonly from: string;
  /** The app's public address, for links in mails (no trailing slash). */
  readonly appUrl: string;
  /** True while a local mail server catches the mail into the outbox (development, demo). */
  readonly outboxEnabled: boolean;
}

/** The columns of a queued message; the Message-ID lets the local mail server find its row again. */
export function queuedRow(mail: OutgoingMail, from: string) {
  const domain = /@([^>\s]+)>?\s*$/.exec(from)?.[1] ?? 'bindery.invalid';
  return {
    messageId: `<${randomUUID()}@${domain}>`,
    envelopeFrom: /<([^>]+)>/.exec(from)?.[1] ?? from,
    envelopeTo: [mail.to.toLowerCase()],
    fromHeader: from,
    toHeader: mail.to,
    subject: mail.subject,
    textBody: mail.text,
    htmlBody: mail.html,
    sizeBytes: Buffer.byteLength(mail.text) + Buffer.byteLength(mail.html),
  };
}

export function createMailService(settings: {
  from: string;
  appUrl: string;
  outboxEnabled: boolean;
  /** The delivery loop of this process, woken after each commit that queued mail. */
  wake: () => void;
}): MailService {
  return {
    from: settings.from,
    appUrl: settings.appUrl,
    outboxEnabled: settings.outboxEnabled,
    async queue(mail, transaction) {
      await OutboxMessage.create(
        { ...queuedRow(mail, settings.from), state: 'pending', nextAttemptAt: new Date() },
        { transaction },
      );
      transaction.afterCommit(settings.wake);
    },
    deliverSoon: settings.wake,
  };
}

export interface TransportOptions {
  host: string;
  port: number;
  secure: boolean;
  /** The local mail server speaks plain SMTP on loopback; a real host may offer STARTTLS. */
  ignoreTLS: boolean;
  auth: { user: string; pass: string } | null;
}

/** One message as the delivery loop hands it to SMTP. */
export interface QueuedMessage {
  messageId: string;
  to: string[];
  from: string;
  subject: string;
  text: string;
  html: string | null;
}

export interface Mailer {
  send(message: QueuedMessage): Promise<void>;
  close(): void;
}

/** The SMTP side: only the delivery loop uses it, never a request. */
export function createMailer(transport: TransportOptions): Mailer {
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
    async send(message) {
      await transporter.sendMail({
        messageId: message.messageId,
        from: message.from,
        to: message.to,
        subject: message.subject,
        text: message.text,
        ...(message.html ? { html: message.html } : {}),
      });
    },
    close: () => transporter.close(),
  };
}
