import { Op } from 'sequelize';
import { Invitation, User } from '../models';

/** A page of a workspace's pending invitations, newest first, with how many there are. */
export async function pendingInvitations(
  workspaceId: string,
  page: { limit: number; offset: number },
): Promise<{ rows: Invitation[]; count: number }> {
  return Invitation.findAndCountAll({
    where: { workspaceId, acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } },
    include: [{ model: User, as: 'inviter', attributes: ['id', 'name'] }],
    order: [
      ['createdAt', 'DESC'],
      ['id', 'DESC'],
    ],
    limit: page.limit,
    offset: page.offset,
  });
}
