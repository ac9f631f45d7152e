// A message the local mail server caught (api/presenters/outbox.ts).
import type { Id } from '../../types/api';

export interface OutboxMessage {
  id: Id;
  message_id: string | null;
  from: string;
  to: string[];
  to_header: string;
  subject: string;
  text: string;
  html: string | null;
  links: string[];
  size_bytes: number;
  received_at: string;
}
