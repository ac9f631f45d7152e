import type { Transaction } from 'sequelize';
import { AuditEvent, type User } from '../models';

// The workspace's one audit trail: models and revisions, the team and sign-off, and
// the receivers on the shelf.
export const AUDIT_ACTIONS = [
  'model.created',
  'model.renamed',
  'model.forked',
  'revision.saved',
  'revision.uploaded',
  'revision.reverted',
  'tag.added',
  'tag.removed',
  'member.invited',
  'invitation.revoked',
  'member.joined',
  'member.role-changed',
  'member.removed',
  'member.left',
  'review.requested',
  'review.verdict',
  'review.commented',
  'comment.replied',
  'comment.resolved',
  'comment.reopened',
  'receiver.added',
  'receiver.updated',
  'receiver.installed',
  'receiver.removed',
  'receiver.settings-applied',
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

export interface AuditEntry {
  workspaceId: string;
  actor: User | null;
  action: AuditAction;
  subjectType: 'model' | 'revision' | 'tag' | 'invitation' | 'member' | 'review' | 'receiver' | 'comment';
  subjectId: string | null;
  details?: Record<string, unknown>;
  createdAt?: Date;
}

/** Written in the transaction of the change it records, so it exists exactly when the change does. */
export async function recordAuditEvent(entry: AuditEntry, transaction: Transaction): Promise<AuditEvent> {
  return AuditEvent.create(
    {
      workspaceId: entry.workspaceId,
      actorId: entry.actor?.id ?? null,
      action: entry.action,
      subjectType: entry.subjectType,
      subjectId: entry.subjectId,
      details: entry.details ?? {},
      ...(entry.createdAt ? { createdAt: entry.createdAt } : {}),
    },
    { transaction },
  );
}
