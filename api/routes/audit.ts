import { Router } from 'express';
import type { AppContext } from '../context';
import { authenticate } from '../middleware/authenticate';
import { AuditEvent, User } from '../models';
import { authorizeWorkspace } from '../policies/model';
import { presentAuthor } from '../presenters/revision';
import { parseInput } from '../validation';
import { auditQuery } from './model-inputs';

const presentAuditEvent = (event: AuditEvent) => ({
  id: event.id,
  action: event.action,
  actor: presentAuthor(event.actor),
  subject: { type: event.subjectType, id: event.subjectId },
  details: event.details,
  created_at: event.createdAt.toISOString(),
});

export function auditRouter({ config }: AppContext): Router {
  const router = Router();

  router.get('/workspaces/:ws/audit', authenticate(config), async (req, res) => {
    const { limit, offset } = parseInput(auditQuery, req.query, 'The paging parameters are not valid.');
    const { workspace } = await authorizeWorkspace(req, req.params.ws, 'audit');
    const { rows, count } = await AuditEvent.findAndCountAll({
      where: { workspaceId: workspace.id },
      include: [{ model: User, as: 'actor', attributes: ['id', 'name'] }],
      order: [['createdAt', 'DESC'], ['id', 'DESC']],
      limit,
      offset,
    });
    res.json({ data: rows.map(presentAuditEvent), pagination: { limit, offset, total: count } });
  });

  return router;
}
