import type { AuditEvent } from '../models';
import { presentAuthor } from './revision';

/** The model an audit event concerns, as the audit route's query found it by the event's subject. */
export interface AuditSubjectModel {
  id: string;
  name: string;
}

export function presentAuditEvent(event: AuditEvent, model: AuditSubjectModel | null) {
  return {
    id: event.id,
    action: event.action,
    actor: presentAuthor(event.actor),
    subject: { type: event.subjectType, id: event.subjectId },
    model: model ? { id: model.id, name: model.name } : null,
    details: event.details,
    created_at: event.createdAt.toISOString(),
  };
}
