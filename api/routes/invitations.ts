import { Router, type Request, type Response } from 'express';
import { verifyLinkToken } from '../auth/link-tokens';
import { setSessionCookie } from '../auth/session-cookie';
import { signSession } from '../auth/tokens';
import { acceptAsMember, acceptWithNewAccount, openInvitation } from '../commands/accept-invitation';
import type { AppContext } from '../context';
import { Unauthorized } from '../errors';
import { authenticate, currentUser } from '../middleware/authenticate';
import { User } from '../models';
import { presentUser } from '../presenters/user';
import { parseInput } from '../validation';
import { acceptSchema } from './team-inputs';

/** The invitation link: anyone holding it may look at it; accepting joins or creates an account. */
export function invitationsRouter({ sequelize, config }: AppContext): Router {
  const router = Router();
  const signedIn = authenticate(config);

  // The caller when the request carries a session; the link itself needs none.
  async function callerIfAny(req: Request, res: Response): Promise<User | null> {
    if (req.get('authorization') === undefined && !req.cookies?.[config.cookieName]) return null;
    await signedIn(req, res, () => {});
    return currentUser(req);
  }

  router.get('/invitations/:token', async (req, res) => {
    const invitation = await openInvitation(verifyLinkToken('invitation', req.params.token, config));
    const account = await User.findOne({ where: { email: invitation.email }, attributes: ['id'] });
    res.json({
      data: {
        workspace: { id: invitation.workspace.id, name: invitation.workspace.name },
        role: invitation.role,
        email: invitation.email,
        invited_by: invitation.inviter ? { id: invitation.inviter.id, name: invitation.inviter.name } : null,
        expires_at: invitation.expiresAt.toISOString(),
        account_exists: account !== null,
      },
    });
  });

  router.post('/invitations/:token/accept', async (req, res) => {
    const id = verifyLinkToken('invitation', req.params.token, config);
    const input = parseInput(acceptSchema, req.body);
    if (input.name !== undefined && input.password !== undefined) {
      const { invitation, membership, user } = await acceptWithNewAccount(sequelize, id, {
        name: input.name,
        password: input.password,
      });
      const token = signSession(user, config);
      setSessionCookie(res, token, config);
      res.status(201).json({
        data: {
          user: presentUser(user),
          token,
          workspace: { id: invitation.workspace.id, name: invitation.workspace.name, role: membership.role },
        },
      });
      return;
    }
    const caller = await callerIfAny(req, res);
    if (!caller) {
      throw new Unauthorized('Sign in to accept this invitation, or send a name and a password to create an account.', {
        code: 'unauthorized',
      });
    }
    const { invitation, membership } = await acceptAsMember(sequelize, id, caller);
    res.json({
      data: {
        user: presentUser(caller),
        workspace: { id: invitation.workspace.id, name: invitation.workspace.name, role: membership.role },
      },
    });
  });

  return router;
}
