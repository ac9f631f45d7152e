// Shapes the team, invitation and audit routes answer with (api/presenters/invitation.ts,
// api/routes/invitations.ts, api/routes/audit.ts).
import type { Id, Role } from '../../types/api';

export type InvitationStatus = 'pending' | 'accepted' | 'revoked' | 'expired';

export interface Invitation {
  id: Id;
  workspace_id: Id;
  email: string;
  role: Role;
  status: InvitationStatus;
  invited_by: { id: Id; name: string } | null;
  expires_at: string;
  accepted_at: string | null;
  revoked_at: string | null;
  created_at: string;
}

/** What the holder of an invitation link sees before accepting. */
export interface InvitationPreview {
  workspace: { id: Id; name: string };
  role: Role;
  email: string;
  invited_by: { id: Id; name: string } | null;
  expires_at: string;
  account_exists: boolean;
}

export interface AuditEvent {
  id: Id;
  action: string;
  actor: { id: Id; name: string } | null;
  subject: { type: string; id: Id | null };
  /** The model the event is about, by its current name; null for team and shelf events. */
  model: { id: Id; name: string } | null;
  details: Record<string, unknown>;
  created_at: string;
}
