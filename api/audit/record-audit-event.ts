import type { Transaction } from 'sequelize';
import { AuditEvent, type User } from '../models';

// The workspace's one audit trail: models and revisions, the team and sign-off, and
// the receivers on the shelf.
export const AUDIT_ACTIONS = [
  'model.created',
  'model.renamed',
  'model.forked',
  'model.archived',
  'model.unarchived',
  'revision.saved',
  'revision.uploaded',
  'revision.reverted',
  'revision.merged',
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
  'rules.changed',
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

export interface AuditEntry {
  workspaceId: string;
  actor: User | null;
  action: AuditAction;
  subjectType: 'model' | 'revision' | 'tag' | 'invitation' | 'member' | 'review' | 'receiver' | 'workspace' | 'comment';
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

/** What `auditInsertSql` writes: an entry whose subject and time come from the row the same statement wrote. */
export type StatementAuditEntry = Omit<AuditEntry, 'subjectId' | 'createdAt'>;

/**
 * The same entry as one part of a statement that writes the change itself, for the
 * hot path where a separate round trip would hold a lock longer (the revision
 * append). `source` names a CTE of that statement whose `id` and `created_at` become
 * the entry's subject and time; with `auditBindings(null)` nothing is written.
 */
export function auditInsertSql(source: string): string {
  return `INSERT INTO audit_events (workspace_id, actor_id, action, subject_type, subject_id, details, created_at)
    SELECT $auditWorkspaceId::uuid, $auditActorId::uuid, $auditAction::text, $auditSubjectType::text, ${source}.id, $auditDetails::jsonb, ${source}.created_at
      FROM ${source} WHERE $auditAction::text IS NOT NULL`;
}

/** The bind parameters `auditInsertSql` reads. */
export function auditBindings(entry: StatementAuditEntry | null): Record<string, unknown> {
  return {
    auditWorkspaceId: entry?.workspaceId ?? null,
    auditActorId: entry?.actor?.id ?? null,
    auditAction: entry?.action ?? null,
    auditSubjectType: entry?.subjectType ?? null,
    auditDetails: JSON.stringify(entry?.details ?? {}),
  };
}
