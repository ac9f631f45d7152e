import type { Transaction } from 'sequelize';
import { AuditEvent, type User } from '../models';

export const RECEIVER_AUDIT_ACTIONS = [
  'receiver.added',
  'receiver.updated',
  'receiver.installed',
  'receiver.removed',
  'receiver.settings-applied',
] as const;
export type ReceiverAuditAction = (typeof RECEIVER_AUDIT_ACTIONS)[number];

export interface ReceiverEvent {
  workspaceId: string;
  actor: User | null;
  action: ReceiverAuditAction;
  receiverId: string;
  details?: Record<string, unknown>;
  createdAt?: Date;
}

/** The shelf's entries in the workspace's audit trail, written in the change's own transaction. */
export async function recordReceiverEvent(event: ReceiverEvent, transaction: Transaction): Promise<AuditEvent> {
  return AuditEvent.create(
    {
      workspaceId: event.workspaceId,
      actorId: event.actor?.id ?? null,
      action: event.action,
      subjectType: 'receiver',
      subjectId: event.receiverId,
      details: event.details ?? {},
      ...(event.createdAt ? { createdAt: event.createdAt } : {}),
    },
    { transaction },
  );
}
