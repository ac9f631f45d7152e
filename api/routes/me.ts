import { Router, type Request, type RequestHandler, type Response } from 'express';
import type { AppContext } from '../context';
import { Unauthorized } from '../errors';
import { authenticate, currentUser } from '../middleware/authenticate';
import { listMemberships } from '../access/membership';
import type { User } from '../models';
import { presentUser } from '../presenters/user';
import { parseInput } from '../validation';
import { pageInput, pagination, type PageInput } from './paging';

// The workspaces come a page at a time like every list; the client's first question
// (the session) gets the first page, and /api/me any other.
const workspacesQuery = pageInput(100);

async function sessionOf(user: User, page: PageInput) {
  const { members, total } = await listMemberships(user.id, page);
  return {
    data: {
      user: presentUser(user),
      workspaces: members.map(({ workspace, role }) => ({ id: workspace.id, name: workspace.name, role })),
    },
    pagination: pagination(page, total),
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
    const page = parseInput(workspacesQuery, req.query, 'The paging parameters are not valid.');
    res.json(await sessionOf(currentUser(req), page));
  });

  // The client's first question on every visit. Signed out is an answer, not an error,
  // so a signed-out visit makes no request that fails (a 401 would be logged by the browser).
  router.get('/session', async (req, res) => {
    if (!(await isSignedIn(check, req, res))) {
      res.json({ data: null });
      return;
    }
    res.json(await sessionOf(currentUser(req), workspacesQuery.parse({})));
  });

  return router;
}
