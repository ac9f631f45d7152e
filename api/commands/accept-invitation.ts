import { UniqueConstraintError, type Sequelize, type Transaction } from 'sequelize';
import { hashPassword } from '../auth/passwords';
import { linkExpired, linkUsed } from '../auth/link-tokens';
import { Conflict, Forbidden, HttpError, NotFound } from '../errors';
import { Invitation, Membership, User, Workspace } from '../models';
import { emailTaken } from './create-account';
import { createWorkspace } from './create-workspace';
import { recordAuditEvent } from '../audit/record-audit-event';

export const invitationNotFound = () =>
  new NotFound('This invitation no longer exists.', { code: 'invitation-not-found' });

/** The invitation a verified token names, refused unless it can still be accepted. */
export async function openInvitation(
  id: string,
  transaction?: Transaction,
): Promise<Invitation & { workspace: Workspace }> {
  const invitation = await Invitation.findByPk(id, {
    include: [
      { model: Workspace, as: 'workspace', required: true },
      { model: User, as: 'inviter', attributes: ['id', 'name'] },
    ],
    transaction,
    // Locks the invitation row only (not the joined ones), so two accepts take turns.
    ...(transaction ? { lock: { level: transaction.LOCK.UPDATE, of: Invitation } } : {}),
  });
  if (!invitation?.workspace) throw invitationNotFound();
  const status = invitation.statusAt(new Date());
  if (status === 'accepted') throw linkUsed('invitation');
  if (status === 'revoked')
    throw new HttpError(410, 'gone', 'This invitation was withdrawn by the workspace owner.', {
      code: 'invitation-revoked',
    });
  if (status === 'expired') throw linkExpired('invitation');
  return invitation as Invitation & { workspace: Workspace };
}

const alreadyMember = (workspace: Workspace) =>
  new Conflict(`You are already a member of ${workspace.name}.`, {
    code: 'already-member',
    details: { workspace_id: workspace.id },
  });

async function join(
  invitation: Invitation & { workspace: Workspace },
  user: User,
  transaction: Transaction,
  created: boolean,
): Promise<Membership> {
  const membership = await Membership.create(
    { workspaceId: invitation.workspaceId, userId: user.id, role: invitation.role },
    { transaction },
  );
  await invitation.update({ acceptedAt: new Date(), acceptedBy: user.id }, { transaction });
  await recordAuditEvent(
    {
      workspaceId: invitation.workspaceId,
      actor: user,
      action: 'member.joined',
      subjectType: 'member',
      subjectId: user.id,
      details: {
        invitation_id: invitation.id,
        email: invitation.email,
        name: user.name,
        role: invitation.role,
        new_account: created,
      },
    },
    transaction,
  );
  return membership;
}

/**
 * An invitation is for one address: only the account with that address may take it, or
 * anyone holding the link could join as whoever they are (and the audit would record
 * the invited address against them).
 */
export function wrongAccount(invitation: Invitation, user: User): Forbidden | null {
  if (user.email.toLowerCase() === invitation.email.toLowerCase()) return null;
  return new Forbidden(
    `This invitation is for ${invitation.email}, and you are signed in as ${user.email}. Sign out, then sign in or create an account with ${invitation.email} to accept it.`,
    { code: 'wrong-account', details: { invited_email: invitation.email, signed_in_email: user.email } },
  );
}

/** The signed-in user, whose address is the invited one, takes the invitation's role in its workspace. */
export async function acceptAsMember(
  sequelize: Sequelize,
  invitationId: string,
  user: User,
): Promise<{ invitation: Invitation & { workspace: Workspace }; membership: Membership }> {
  return sequelize.transaction(async (transaction) => {
    const invitation = await openInvitation(invitationId, transaction);
    const refusal = wrongAccount(invitation, user);
    if (refusal) throw refusal;
    const existing = await Membership.findOne({
      where: { workspaceId: invitation.workspaceId, userId: user.id },
      transaction,
    });
    if (existing) throw alreadyMember(invitation.workspace);
    return { invitation, membership: await join(invitation, user, transaction, false) };
  });
}

/** A new account for the invited address (with a personal workspace, as on sign-up) that joins at once. */
export async function acceptWithNewAccount(
  sequelize: Sequelize,
  invitationId: string,
  account: { name: string; password: string },
): Promise<{ invitation: Invitation & { workspace: Workspace }; membership: Membership; user: User }> {
  const passwordHash = await hashPassword(account.password);
  try {
    return await sequelize.transaction(async (transaction) => {
      const invitation = await openInvitation(invitationId, transaction);
      if (await User.findOne({ where: { email: invitation.email }, transaction })) {
        throw new Conflict(
          `An account for ${invitation.email} exists already: sign in with it, then open the invitation link again.`,
          { code: 'account-exists' },
        );
      }
      const user = await User.create({ email: invitation.email, name: account.name, passwordHash }, { transaction });
      await createWorkspace(sequelize, { owner: user, name: `${account.name}'s workspace`, transaction });
      return { invitation, user, membership: await join(invitation, user, transaction, true) };
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw emailTaken();
    throw error;
  }
}
