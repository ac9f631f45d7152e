import type { Transaction } from 'sequelize';
import { AuditEvent, type User } from '../models';

// The workspace's audit trail beside the model events (record-audit-event.ts): who
// joined, was invited, changed role or left, and who asked for and gave sign-off.
export const TEAM_AUDIT_ACTIONS = [
  'member.invited',
  'invitation.revoked',
  'member.joined',
  'member.role-changed',
  'member.removed',
  'member.left',
  'review.requested',
  'review.verdict',
  'review.commented',
] as const;
export type TeamAuditAction = (typeof TEAM_AUDIT_ACTIONS)[number];

export interface TeamAuditEntry {
  workspaceId: string;
  actor: User | null;
  action: TeamAuditAction;
  subjectType: 'invitation' | 'member' | 'review';
  subjectId: string | null;
  details: Record<string, unknown>;
  createdAt?: Date;
}

/** Written in the transaction of the change it records, so it exists exactly when the change does. */
export function recordTeamEvent(entry: TeamAuditEntry, transaction: Transaction): Promise<AuditEvent> {
  return AuditEvent.create(
    {
      workspaceId: entry.workspaceId,
      actorId: entry.actor?.id ?? null,
      action: entry.action,
      subjectType: entry.subjectType,
      subjectId: entry.subjectId,
      details: entry.details,
      ...(entry.createdAt ? { createdAt: entry.createdAt } : {}),
    },
    { transaction },
  );
}
