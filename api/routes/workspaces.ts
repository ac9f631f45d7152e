import { Router } from 'express';
import { z } from 'zod';
import { createWorkspace } from '../commands/create-workspace';
import type { AppContext } from '../context';
import { authenticate, currentUser } from '../middleware/authenticate';
import { Membership, User } from '../models';
import { authorizeWorkspaceAction } from './authorize';
import { pageInput, pagination } from './paging';
import { presentMember, presentWorkspace } from '../presenters/workspace';
import { SINGLE_LINE_MESSAGE, parseInput, singleLine } from '../validation';

const workspaceName = z
  .string({ error: 'Give the workspace a name.' })
  .trim()
  .min(1, 'Give the workspace a name.')
  .max(100, 'Keep the name to 100 characters.')
  .refine(singleLine, SINGLE_LINE_MESSAGE);

const createSchema = z.object({ name: workspaceName });
// Strict: a misspelt field in a change would otherwise be dropped without a word.
const updateSchema = z.strictObject({ name: workspaceName.optional() });

const membersQuery = pageInput(100);

export function workspacesRouter({ sequelize, config }: AppContext): Router {
  const router = Router();
  router.use('/workspaces', authenticate(config));

  router.post('/workspaces', async (req, res) => {
    const { name } = parseInput(createSchema, req.body);
    const workspace = await createWorkspace(sequelize, { owner: currentUser(req), name });
    res.status(201).json({ data: presentWorkspace(workspace, 'owner') });
  });

  router.get('/workspaces/:ws', async (req, res) => {
    const { workspace, role } = await authorizeWorkspaceAction(req, req.params.ws, 'read');
    res.json({ data: presentWorkspace(workspace, role) });
  });

  router.patch('/workspaces/:ws', async (req, res) => {
    const { workspace, role } = await authorizeWorkspaceAction(req, req.params.ws, 'rename');
    const changes = parseInput(updateSchema, req.body);
    if (changes.name !== undefined) await workspace.update({ name: changes.name });
    res.json({ data: presentWorkspace(workspace, role) });
  });

  router.get('/workspaces/:ws/members', async (req, res) => {
    const { workspace } = await authorizeWorkspaceAction(req, req.params.ws, 'read-members');
    const { limit, offset } = parseInput(membersQuery, req.query, 'The paging parameters are not valid.');
    const { rows, count } = await Membership.findAndCountAll({
      where: { workspaceId: workspace.id },
      include: [{ model: User, as: 'user', required: true }],
      order: [
        [{ model: User, as: 'user' }, 'name', 'ASC'],
        ['id', 'ASC'],
      ],
      limit,
      offset,
    });
    res.json({ data: rows.map(presentMember), pagination: pagination({ limit, offset }, count) });
  });

  return router;
}
