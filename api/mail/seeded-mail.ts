import type { OutboxMessage } from '../models';
import { DEFAULT_FROM } from './mail-settings';
import type { OutgoingMail } from './mail-service';

/**
 * A composed mail as the outbox stores a delivered and caught one, for demo data written
 * without a mail server in between (so the delivery loop leaves it alone). The links it
 * carries are those of the composed mail.
 */
export function composeMailFrom(
  mail: OutgoingMail,
  at: Date,
): Pick<
  OutboxMessage,
  | 'messageId'
  | 'envelopeFrom'
  | 'envelopeTo'
  | 'fromHeader'
  | 'toHeader'
  | 'subject'
  | 'textBody'
  | 'htmlBody'
  | 'sizeBytes'
  | 'state'
  | 'nextAttemptAt'
  | 'queuedAt'
  | 'deliveredAt'
  | 'receivedAt'
> {
  const from = process.env.MAIL_FROM?.trim() || DEFAULT_FROM;
  return {
    messageId: null,
    envelopeFrom: /<([^>]+)>/.exec(from)?.[1] ?? from,
    envelopeTo: [mail.to],
    fromHeader: from,
    toHeader: mail.to,
    subject: mail.subject,
    textBody: mail.text,
    htmlBody: mail.html,
    sizeBytes: Buffer.byteLength(mail.text) + Buffer.byteLength(mail.html),
    state: 'delivered',
    nextAttemptAt: null,
    queuedAt: at,
    deliveredAt: at,
    receivedAt: at,
  };
}
