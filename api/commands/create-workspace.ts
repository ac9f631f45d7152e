import type { Transaction } from 'sequelize';
import { Membership, Workspace, type User } from '../models';

/** A new workspace with its creator as owner, in the caller's transaction. */
export async function createWorkspace(owner: User, name: string, transaction: Transaction): Promise<Workspace> {
  const workspace = await Workspace.create({ name }, { transaction });
  await Membership.create({ workspaceId: workspace.id, userId: owner.id, role: 'owner' }, { transaction });
  return workspace;
}
