import { Router } from 'express';
import type { AppContext } from '../context';
import { authenticate, currentUser } from '../middleware/authenticate';
import { Membership, Workspace } from '../models';
import { presentUser } from '../presenters/user';

export function meRouter({ config }: AppContext): Router {
  const router = Router();

  router.get('/me', authenticate(config), async (req, res) => {
    const user = currentUser(req);
    const memberships = await Membership.findAll({
      where: { userId: user.id },
      include: [{ model: Workspace, as: 'workspace', required: true }],
      order: [
        [{ model: Workspace, as: 'workspace' }, 'name', 'ASC'],
        ['createdAt', 'ASC'],
      ],
    });
    res.json({
      data: {
        user: presentUser(user),
        workspaces: memberships.map((membership) => ({
          id: membership.workspaceId,
          name: membership.workspace!.name,
          role: membership.role,
        })),
      },
    });
  });

  return router;
}
