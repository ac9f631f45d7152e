import { Router } from 'express';
import { changeMemberRole, removeMember } from '../commands/manage-members';
import { inviteMember } from '../commands/invite-member';
import { invitationNotFound, revokeInvitation } from '../commands/revoke-invitation';
import type { AppContext } from '../context';
import { NotFound } from '../errors';
import { mailFor } from '../mail/context';
import { authenticate, currentUser } from '../middleware/authenticate';
import { authorizeWorkspaceAction } from './authorize';
import { presentInvitation } from '../presenters/invitation';
import { pendingInvitations } from '../queries/invitations';
import { presentMember } from '../presenters/workspace';
import { idSchema, parseInput } from '../validation';
import { pageInput, pagination } from './paging';
import { changeRoleSchema, inviteSchema } from './team-inputs';

const invitationsQuery = pageInput(50);

const memberNotFound = () =>
  new NotFound('This person is not a member of the workspace.', { code: 'member-not-found' });

function userIdParam(value: unknown): string {
  const id = idSchema.safeParse(value);
  if (!id.success) throw memberNotFound();
  return id.data;
}

/** Invitations, roles and leaving: the owners run the team, anyone may leave it. */
export function teamRouter(context: AppContext): Router {
  const { sequelize, config } = context;
  const router = Router();
  const signedIn = authenticate(config);

  router.get('/workspaces/:ws/invitations', signedIn, async (req, res) => {
    const page = parseInput(invitationsQuery, req.query, 'The paging parameters are not valid.');
    const { workspace } = await authorizeWorkspaceAction(req, req.params.ws, 'manage-team');
    const { rows, count } = await pendingInvitations(workspace.id, page);
    res.json({ data: rows.map((invitation) => presentInvitation(invitation)), pagination: pagination(page, count) });
  });

  router.post('/workspaces/:ws/invitations', signedIn, async (req, res) => {
    const input = parseInput(inviteSchema, req.body);
    const { workspace } = await authorizeWorkspaceAction(req, req.params.ws, 'manage-team');
    const invitation = await inviteMember(sequelize, config, mailFor(context), {
      workspace,
      inviter: currentUser(req),
      ...input,
    });
    res.status(201).json({ data: presentInvitation(invitation) });
  });

  router.delete('/workspaces/:ws/invitations/:id', signedIn, async (req, res) => {
    const { workspace } = await authorizeWorkspaceAction(req, req.params.ws, 'manage-team');
    const id = idSchema.safeParse(req.params.id);
    if (!id.success) throw invitationNotFound();
    const invitation = await revokeInvitation(sequelize, { workspace, invitationId: id.data, actor: currentUser(req) });
    res.json({ data: presentInvitation(invitation) });
  });

  router.patch('/workspaces/:ws/members/:userId', signedIn, async (req, res) => {
    const { role } = parseInput(changeRoleSchema, req.body);
    const { workspace } = await authorizeWorkspaceAction(req, req.params.ws, 'manage-team');
    const membership = await changeMemberRole(sequelize, {
      workspace,
      actor: currentUser(req),
      userId: userIdParam(req.params.userId),
      role,
    });
    res.json({ data: presentMember(membership) });
  });

  router.delete('/workspaces/:ws/members/:userId', signedIn, async (req, res) => {
    const actor = currentUser(req);
    const userId = userIdParam(req.params.userId);
    const { workspace } = await authorizeWorkspaceAction(req, req.params.ws, 'remove-member', {
      userId,
      callerId: actor.id,
    });
    await removeMember(sequelize, { workspace, actor, userId });
    res.json({ data: { removed: true, user_id: userId, left: userId === actor.id } });
  });

  return router;
}
