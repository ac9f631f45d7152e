import type { Sequelize } from 'sequelize';
import { NotFound } from '../errors';
import { Invitation, type User, type Workspace } from '../models';
import { recordAuditEvent } from '../audit/record-audit-event';

export const invitationNotFound = () =>
  new NotFound('No such invitation in this workspace.', { code: 'invitation-not-found' });

/**
 * Withdraws a pending invitation so its link no longer works. The row is locked so a
 * revoke and an acceptance of one invitation queue; one that is no longer pending
 * (accepted, expired, revoked already) is answered as it is, unchanged.
 */
export function revokeInvitation(
  sequelize: Sequelize,
  input: { workspace: Workspace; invitationId: string; actor: User },
): Promise<Invitation> {
  return sequelize.transaction(async (transaction) => {
    const found = await Invitation.findOne({
      where: { id: input.invitationId, workspaceId: input.workspace.id },
      lock: transaction.LOCK.UPDATE,
      transaction,
    });
    if (!found) throw invitationNotFound();
    if (found.statusAt(new Date()) !== 'pending') return found;
    await found.update({ revokedAt: new Date() }, { transaction });
    await recordAuditEvent(
      {
        workspaceId: input.workspace.id,
        actor: input.actor,
        action: 'invitation.revoked',
        subjectType: 'invitation',
        subjectId: found.id,
        details: { email: found.email, role: found.role },
      },
      transaction,
    );
    return found;
  });
}
