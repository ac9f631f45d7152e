import type { Membership, Workspace } from '../models';
import type { Role } from '@shared/contract/roles';

/** A workspace as the caller sees it: with the caller's own role. */
export function presentWorkspace(workspace: Workspace, role: Role) {
  return {
    id: workspace.id,
    name: workspace.name,
    role,
    created_at: workspace.createdAt.toISOString(),
    updated_at: workspace.updatedAt.toISOString(),
  };
}

/** A membership loaded with its user. */
export function presentMember(membership: Membership) {
  const user = membership.user;
  if (!user) throw new Error('presentMember needs the membership loaded with its user');
  return {
    user: { id: user.id, email: user.email, name: user.name },
    role: membership.role,
    joined_at: membership.createdAt.toISOString(),
  };
}
