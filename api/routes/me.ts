import { Router, type Request, type RequestHandler, type Response } from 'express';
import type { AppContext } from '../context';
import { Unauthorized } from '../errors';
import { authenticate, currentUser } from '../middleware/authenticate';
import { Membership, Workspace, type User } from '../models';
import { presentUser } from '../presenters/user';

async function sessionOf(user: User) {
  const memberships = await Membership.findAll({
    where: { userId: user.id },
    include: [{ model: Workspace, as: 'workspace', required: true }],
    order: [
      [{ model: Workspace, as: 'workspace' }, 'name', 'ASC'],
      ['createdAt', 'ASC'],
    ],
  });
  return {
    user: presentUser(user),
    workspaces: memberships.map((membership) => ({
      id: membership.workspaceId,
      name: membership.workspace!.name,
      role: membership.role,
    })),
  };
}

/** Whether the request carries a valid session: the same checks as `authenticate`, answered as a boolean. */
async function isSignedIn(check: RequestHandler, req: Request, res: Response): Promise<boolean> {
  try {
    await new Promise<void>((resolve, reject) => {
      const done = (error?: unknown) =>
        error
          ? reject(error instanceof Error ? error : new Error('The session check failed.', { cause: error }))
          : resolve();
      Promise.resolve(check(req, res, done)).catch(reject);
    });
    return true;
  } catch (error) {
    if (error instanceof Unauthorized) return false;
    throw error;
  }
}

export function meRouter({ config }: AppContext): Router {
  const router = Router();
  const check = authenticate(config);

  router.get('/me', check, async (req, res) => {
    res.json({ data: await sessionOf(currentUser(req)) });
  });

  // The client's first question on every visit. Signed out is an answer, not an error,
  // so a signed-out visit makes no request that fails (a 401 would be logged by the browser).
  router.get('/session', async (req, res) => {
    res.json({ data: (await isSignedIn(check, req, res)) ? await sessionOf(currentUser(req)) : null });
  });

  return router;
}
