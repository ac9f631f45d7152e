import type { Request } from 'express';
import { Forbidden, NotFound } from '../errors';
import { currentUser } from '../middleware/authenticate';
import { Membership, Workspace } from '../models';
import { idSchema } from '../validation';
import { roleAtLeast, type Role } from '@shared/contract/roles';

export interface WorkspaceAccess {
  workspace: Workspace;
  membership: Membership;
  role: Role;
}

/**
 * The guard every workspace-owned record goes through. A caller who is not a member
 * learns nothing (404, as if it did not exist); a member whose role is too low gets 403.
 */
export async function requireRole(req: Request, workspaceId: unknown, minimum: Role): Promise<WorkspaceAccess> {
  const user = currentUser(req);
  const id = idSchema.safeParse(workspaceId);
  const notFound = new NotFound('No such workspace.', { code: 'workspace-not-found' });
  if (!id.success) throw notFound;
  const membership = await Membership.findOne({
    where: { workspaceId: id.data, userId: user.id },
    include: [{ model: Workspace, as: 'workspace', required: true }],
  });
  if (!membership?.workspace) throw notFound;
  if (!roleAtLeast(membership.role, minimum)) {
    throw new Forbidden(`This needs the ${minimum} role or higher; your role here is ${membership.role}.`, {
      code: 'role-too-low',
      details: { required: minimum, role: membership.role },
    });
  }
  return { workspace: membership.workspace, membership, role: membership.role };
}
