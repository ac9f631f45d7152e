import { Router } from 'express';
import { clubRulesSchema, DEFAULT_SEVERITIES } from '@shared/rules/club-rules';
import type { ClubRulesView } from '@shared/contract/club-rules';
import { setClubRules } from '../commands/set-club-rules';
import type { AppContext } from '../context';
import { authenticate, currentUser } from '../middleware/authenticate';
import { AuditEvent, ClubRules, rulesOf, User } from '../models';
import { presentAuthor } from '../presenters/revision';
import { parseInput } from '../validation';
import { authorizeWorkspaceAction } from './authorize';

const HISTORY_LIMIT = 20;

async function presentRules(workspaceId: string): Promise<ClubRulesView> {
  const [rules, row, events] = await Promise.all([
    rulesOf(workspaceId),
    ClubRules.findByPk(workspaceId, { attributes: ['updatedAt', 'updatedBy'] }),
    AuditEvent.findAll({
      where: { workspaceId, action: 'rules.changed' },
      include: [{ model: User, as: 'actor', attributes: ['id', 'name'] }],
      order: [
        ['createdAt', 'DESC'],
        ['id', 'DESC'],
      ],
      limit: HISTORY_LIMIT,
    }),
  ]);
  return {
    ...rules,
    defaults: Object.fromEntries(DEFAULT_SEVERITIES),
    updated_at: row ? row.updatedAt.toISOString() : null,
    history: events.map((event) => ({
      at: event.createdAt.toISOString(),
      actor: presentAuthor(event.actor),
      before: event.details.before as ClubRulesView['history'][number]['before'],
      after: event.details.after as ClubRulesView['history'][number]['after'],
    })),
  };
}

/** A workspace's club rules: every member reads them, the owners set them. */
export function clubRulesRouter({ sequelize, config }: AppContext): Router {
  const router = Router();
  const signedIn = authenticate(config);

  router.get('/workspaces/:ws/rules', signedIn, async (req, res) => {
    const { workspace } = await authorizeWorkspaceAction(req, req.params.ws, 'read-rules');
    res.json({ data: await presentRules(workspace.id) });
  });

  router.put('/workspaces/:ws/rules', signedIn, async (req, res) => {
    const rules = parseInput(clubRulesSchema, req.body, 'The club rules are not valid.');
    const { workspace } = await authorizeWorkspaceAction(req, req.params.ws, 'set-rules');
    await setClubRules(sequelize, workspace, currentUser(req), rules);
    res.json({ data: await presentRules(workspace.id) });
  });

  return router;
}
