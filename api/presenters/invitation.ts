import type { Invitation } from '../models';

/** An invitation as its workspace's owners see it; the token itself only ever goes out by mail. */
export function presentInvitation(invitation: Invitation, now = new Date()) {
  return {
    id: invitation.id,
    workspace_id: invitation.workspaceId,
    email: invitation.email,
    role: invitation.role,
    status: invitation.statusAt(now),
    invited_by: invitation.inviter ? { id: invitation.inviter.id, name: invitation.inviter.name } : null,
    expires_at: invitation.expiresAt.toISOString(),
    accepted_at: invitation.acceptedAt?.toISOString() ?? null,
    revoked_at: invitation.revokedAt?.toISOString() ?? null,
    created_at: invitation.createdAt.toISOString(),
  };
}
