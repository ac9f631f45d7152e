import type { AddressInfo } from 'node:net';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { OutboxMessage } from '../models';

export interface LocalMailServer {
  host: string;
  port: number;
  close(): Promise<void>;
}

const MAX_MESSAGE_BYTES = 2 * 1024 * 1024;

function addressText(value: AddressObject | AddressObject[] | undefined): string {
  if (!value) return '';
  return (Array.isArray(value) ? value : [value])
    .flatMap((group) => group.value)
    .map((address) => (address.name ? `${address.name} <${address.address ?? ''}>` : (address.address ?? '')))
    .join(', ');
}

/**
 * A mail server on loopback that stands in for a hosted one: every message it is
 * handed is parsed and recorded in the outbox table before the SMTP transaction is
 * answered, so a delivery that succeeded can be read back at once. Only Bindery's own
 * delivery loop talks to it (127.0.0.1, no relaying anywhere).
 */
export function startLocalMailServer(options: { port?: number | null; host?: string } = {}): Promise<LocalMailServer> {
  const host = options.host ?? '127.0.0.1';
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    banner: 'Bindery local mail server',
    size: MAX_MESSAGE_BYTES,
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (mail) => {
          const html = typeof mail.html === 'string' ? mail.html : null;
          const caught = {
            envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
            envelopeTo: session.envelope.rcptTo.map((recipient) => recipient.address.toLowerCase()),
            fromHeader: addressText(mail.from),
            toHeader: addressText(mail.to),
            subject: mail.subject ?? '',
            textBody: mail.text ?? '',
            htmlBody: html,
            sizeBytes: html
              ? Buffer.byteLength(html) + Buffer.byteLength(mail.text ?? '')
              : Buffer.byteLength(mail.text ?? ''),
            receivedAt: new Date(),
          };
          // Our own queued mail: the catch is written onto its queue row, as parsed back
          // from the wire, so the Outbox shows what really travelled.
          if (mail.messageId) {
            const [updated] = await OutboxMessage.update(caught, { where: { messageId: mail.messageId } });
            if (updated > 0) return;
          }
          await OutboxMessage.create({
            ...caught,
            messageId: mail.messageId ?? null,
            state: 'delivered',
            nextAttemptAt: null,
            deliveredAt: caught.receivedAt,
          });
        })
        .then(
          () => callback(),
          (error: Error) => callback(error),
        );
    },
  });

  return new Promise((resolve, reject) => {
    server.on('error', reject);
    const listener = server.listen(options.port ?? 0, host, () => {
      server.off('error', reject);
      const { port } = listener.address() as AddressInfo;
      resolve({
        host,
        port,
        close: () => new Promise<void>((done) => server.close(() => done())),
      });
    });
  });
}
