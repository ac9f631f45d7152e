import { Router } from 'express';
import { literal } from 'sequelize';
import type { AppContext } from '../context';
import { authenticate } from '../middleware/authenticate';
import { AuditEvent, User } from '../models';
import { modelPolicy } from '../policies/model';
import { authorizeWorkspace } from './authorize';
import { presentAuditEvent, type AuditSubjectModel } from '../presenters/audit';
import { parseInput } from '../validation';
import { pagination } from './paging';
import { auditQuery } from './model-inputs';

// The model an event is about, found from its subject rather than from its details, so
// events written before the details named a model are answered with it too. A removed
// tag's row is gone, so a tag event names its model in its details, as it always has;
// the model is looked for in the event's own workspace only.
const SUBJECT_MODEL = literal(`(
  SELECT json_build_object('id', m.id, 'name', m.name) FROM models m
   WHERE m.workspace_id = "AuditEvent"."workspace_id"
     AND m.id = CASE "AuditEvent"."subject_type"
       WHEN 'model' THEN "AuditEvent"."subject_id"
       WHEN 'revision' THEN (SELECT r.model_id FROM revisions r WHERE r.id = "AuditEvent"."subject_id")
       WHEN 'review' THEN (SELECT v.model_id FROM reviews v WHERE v.id = "AuditEvent"."subject_id")
       WHEN 'tag' THEN CASE WHEN "AuditEvent"."details"->>'model_id' ~ '^[0-9a-fA-F-]{36}$' THEN ("AuditEvent"."details"->>'model_id')::uuid END
     END
)`);

export function auditRouter({ config }: AppContext): Router {
  const router = Router();

  router.get('/workspaces/:ws/audit', authenticate(config), async (req, res) => {
    const { limit, offset } = parseInput(auditQuery, req.query, 'The paging parameters are not valid.');
    const { workspace } = await authorizeWorkspace(req, req.params.ws, modelPolicy, 'audit');
    const { rows, count } = await AuditEvent.findAndCountAll({
      where: { workspaceId: workspace.id },
      attributes: { include: [[SUBJECT_MODEL, 'subjectModel']] },
      include: [{ model: User, as: 'actor', attributes: ['id', 'name'] }],
      order: [
        ['createdAt', 'DESC'],
        ['id', 'DESC'],
      ],
      limit,
      offset,
    });
    res.json({
      data: rows.map((event) =>
        presentAuditEvent(event, (event.get('subjectModel') as AuditSubjectModel | null) ?? null),
      ),
      pagination: pagination({ limit, offset }, count),
    });
  });

  return router;
}
