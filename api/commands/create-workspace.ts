import type { Sequelize, Transaction } from 'sequelize';
import { inTransaction } from '../db/transaction';
import { Membership, Workspace, type User } from '../models';

/** A new workspace with its creator as owner, together or not at all (in the caller's transaction when given). */
export function createWorkspace(
  sequelize: Sequelize,
  input: { owner: User; name: string; transaction?: Transaction },
): Promise<Workspace> {
  return inTransaction(sequelize, input.transaction, async (transaction) => {
    const workspace = await Workspace.create({ name: input.name }, { transaction });
    await Membership.create({ workspaceId: workspace.id, userId: input.owner.id, role: 'owner' }, { transaction });
    return workspace;
  });
}
