import type { Role } from '@shared/contract/roles';
import { needsRole, type Decision } from './decision';

// The workspace itself and its team. Everyone in it sees it and its members; owners
// rename it, invite, change roles and remove people; anyone may leave.
export const WORKSPACE_POLICY = {
  read: 'viewer',
  rename: 'owner',
  'read-members': 'viewer',
  'manage-team': 'owner',
} as const satisfies Record<string, Role>;

export type WorkspaceAction = keyof typeof WORKSPACE_POLICY | 'remove-member';

/** For `remove-member`: who is removed, and who asks. */
export interface MemberRecord {
  userId: string;
  callerId: string;
}

export function workspacePolicy(role: Role | null, action: WorkspaceAction, record?: MemberRecord): Decision {
  if (action === 'remove-member') {
    // Leaving needs only membership; removing someone else needs an owner.
    return needsRole(role, record && record.userId === record.callerId ? 'viewer' : 'owner');
  }
  return needsRole(role, WORKSPACE_POLICY[action]);
}
