import type { Transaction } from 'sequelize';
import type { AuditEvent, User } from '../models';
import { recordAuditEvent, type AuditAction } from './record-audit-event';

export interface ReceiverEvent {
  workspaceId: string;
  actor: User | null;
  action: Extract<AuditAction, `receiver.${string}`>;
  receiverId: string;
  details?: Record<string, unknown>;
  createdAt?: Date;
}

/** The shelf's entries in the workspace's audit trail, written in the change's own transaction. */
export function recordReceiverEvent(
  { receiverId, ...event }: ReceiverEvent,
  transaction: Transaction,
): Promise<AuditEvent> {
  return recordAuditEvent({ ...event, subjectType: 'receiver', subjectId: receiverId }, transaction);
}
