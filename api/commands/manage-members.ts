import type { Sequelize, Transaction } from 'sequelize';
import { Conflict, NotFound } from '../errors';
import { Membership, User, type Workspace } from '../models';
import type { Role } from '@shared/contract/roles';
import { recordAuditEvent } from '../audit/record-audit-event';

const memberNotFound = () =>
  new NotFound('This person is not a member of the workspace.', { code: 'member-not-found' });

const lastOwner = (doing: string) =>
  new Conflict(`A workspace needs an owner: ${doing} would leave it without one. Make another member an owner first.`, {
    code: 'last-owner',
  });

/**
 * Every membership of the workspace, locked for the rest of the transaction, so two
 * owners demoting each other at once cannot both succeed and leave no owner behind.
 */
async function lockMembers(workspace: Workspace, transaction: Transaction): Promise<Membership[]> {
  return Membership.findAll({
    where: { workspaceId: workspace.id },
    order: [['id', 'ASC']],
    lock: transaction.LOCK.UPDATE,
    transaction,
  });
}

async function memberIn(
  memberships: Membership[],
  userId: string,
  transaction: Transaction,
): Promise<{ membership: Membership; user: User }> {
  const membership = memberships.find((candidate) => candidate.userId === userId);
  if (!membership) throw memberNotFound();
  const user = await User.findByPk(userId, { transaction });
  if (!user) throw memberNotFound();
  return { membership, user };
}

const ownerCount = (memberships: Membership[]) =>
  memberships.filter((membership) => membership.role === 'owner').length;

export async function changeMemberRole(
  sequelize: Sequelize,
  input: { workspace: Workspace; actor: User; userId: string; role: Role },
): Promise<Membership> {
  return sequelize.transaction(async (transaction) => {
    const memberships = await lockMembers(input.workspace, transaction);
    const { membership, user } = await memberIn(memberships, input.userId, transaction);
    const from = membership.role;
    if (from === input.role) return Object.assign(membership, { user });
    if (from === 'owner' && ownerCount(memberships) === 1)
      throw lastOwner(`making ${user.name} ${input.role === 'editor' ? 'an' : 'a'} ${input.role}`);
    await membership.update({ role: input.role }, { transaction });
    await recordAuditEvent(
      {
        workspaceId: input.workspace.id,
        actor: input.actor,
        action: 'member.role-changed',
        subjectType: 'member',
        subjectId: user.id,
        details: { name: user.name, email: user.email, from, to: input.role },
      },
      transaction,
    );
    return Object.assign(membership, { user });
  });
}

/** Removes a member; removing oneself is leaving the workspace. */
export async function removeMember(
  sequelize: Sequelize,
  input: { workspace: Workspace; actor: User; userId: string },
): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const memberships = await lockMembers(input.workspace, transaction);
    const { membership, user } = await memberIn(memberships, input.userId, transaction);
    const leaving = user.id === input.actor.id;
    if (membership.role === 'owner' && ownerCount(memberships) === 1)
      throw lastOwner(leaving ? 'leaving' : `removing ${user.name}`);
    await membership.destroy({ transaction });
    await recordAuditEvent(
      {
        workspaceId: input.workspace.id,
        actor: input.actor,
        action: leaving ? 'member.left' : 'member.removed',
        subjectType: 'member',
        subjectId: user.id,
        details: { name: user.name, email: user.email, role: membership.role },
      },
      transaction,
    );
  });
}
