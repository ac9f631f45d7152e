import type { Sequelize } from 'sequelize';
import { signLinkToken } from '../auth/link-tokens';
import type { AppConfig } from '../config';
import { Conflict } from '../errors';
import { appLink } from '../mail/context';
import type { MailService } from '../mail/mail-service';
import { invitationMail } from '../mail/messages';
import { Invitation, Membership, User, type Workspace } from '../models';
import type { Role } from '@shared/contract/roles';
import { recordAuditEvent } from '../audit/record-audit-event';

export const INVITATION_TTL_MS = 7 * 24 * 60 * 60 * 1000;

export interface InviteInput {
  workspace: Workspace;
  inviter: User;
  email: string;
  role: Role;
}

/**
 * A new invitation, mailed. Inviting an address again replaces its open invitation, so
 * only the newest link works. The mail is queued in the same transaction, so there is
 * never an invitation without its mail nor a mail without its invitation; the delivery
 * loop sends it after commit and retries when the mail server is away.
 */
export async function inviteMember(
  sequelize: Sequelize,
  config: AppConfig,
  mail: MailService,
  input: InviteInput,
): Promise<Invitation> {
  return sequelize.transaction(async (transaction) => {
    const existing = await User.findOne({
      where: { email: input.email },
      include: [{ model: Membership, as: 'memberships', where: { workspaceId: input.workspace.id }, required: true }],
      transaction,
    });
    if (existing) {
      throw new Conflict(`${input.email} is already a member of ${input.workspace.name}.`, {
        code: 'already-member',
        details: { fields: { email: 'This address already belongs to a member of this workspace.' } },
      });
    }
    const now = new Date();
    await Invitation.update(
      { revokedAt: now },
      {
        where: { workspaceId: input.workspace.id, email: input.email, acceptedAt: null, revokedAt: null },
        transaction,
      },
    );
    const invitation = await Invitation.create(
      {
        workspaceId: input.workspace.id,
        email: input.email,
        role: input.role,
        invitedBy: input.inviter.id,
        expiresAt: new Date(now.getTime() + INVITATION_TTL_MS),
      },
      { transaction },
    );
    invitation.inviter = input.inviter;
    await recordAuditEvent(
      {
        workspaceId: input.workspace.id,
        actor: input.inviter,
        action: 'member.invited',
        subjectType: 'invitation',
        subjectId: invitation.id,
        details: { email: invitation.email, role: invitation.role },
      },
      transaction,
    );
    const token = signLinkToken('invitation', invitation.id, invitation.expiresAt, config);
    await mail.queue(
      invitationMail({
        to: invitation.email,
        inviter: input.inviter.name,
        workspace: input.workspace.name,
        role: invitation.role,
        url: appLink(mail, `/invitations/${token}`),
        expiresAt: invitation.expiresAt,
      }),
      transaction,
    );
    return invitation;
  });
}
