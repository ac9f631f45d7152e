import type { OutboxMessage } from '../models';

// Links in our own mails are plain absolute addresses; the Outbox screen makes them clickable.
const LINK = /https?:\/\/[^\s<>"')\]]+/g;

export function linksIn(text: string): string[] {
  return [...new Set(text.match(LINK) ?? [])];
}

export function presentOutboxMessage(message: OutboxMessage) {
  return {
    id: message.id,
    message_id: message.messageId,
    from: message.fromHeader,
    to: message.envelopeTo,
    to_header: message.toHeader,
    subject: message.subject,
    text: message.textBody,
    html: message.htmlBody,
    links: linksIn(message.textBody),
    size_bytes: message.sizeBytes,
    state: message.state,
    // The Outbox lists caught mail only, which always has a catch time.
    received_at: (message.receivedAt ?? message.queuedAt).toISOString(),
  };
}
