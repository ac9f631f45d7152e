import { Router } from 'express';
import { QueryTypes } from 'sequelize';
import { z } from 'zod';
import { takeInSource } from '../commands/take-in-source';
import type { AppContext } from '../context';
import { NotFound } from '../errors';
import { authenticate, currentUser } from '../middleware/authenticate';
import { presentSavedRevision } from '../presenters/revision';
import { historyOf } from '../provenance/history-of';
import { provenanceOf } from '../provenance/provenance-of';
import { mergeSides, presentSourceUpdates } from '../queries/source-updates';
import { idSchema, parseInput } from '../validation';
import { authorizeModel } from './authorize';
import { baseField, message } from './model-inputs';
import { pageInput, pagination } from './paging';

const provenanceQuery = z.object({
  revision: idSchema.optional(),
  path: z.string().max(1000, 'path is at most 1000 characters.').optional(),
});

const historyQuery = pageInput(20).extend({
  path: z
    .string({ error: 'Name the setting: ?path=<identity path>.' })
    .min(1, 'Name the setting: ?path=<identity path>.')
    .max(1000, 'path is at most 1000 characters.'),
});

const takeInSchema = z.strictObject({
  base: baseField,
  resolutions: z
    .record(z.string().max(1000), z.enum(['ours', 'theirs'], { error: 'Each resolution is "ours" or "theirs".' }))
    .default({}),
  message: message.optional(),
});

/** Where each value came from, and forks that take in their source's newer revisions. */
export function lineageRouter({ sequelize, config }: AppContext): Router {
  const router = Router();
  const signedIn = authenticate(config);

  router.get('/models/:id/provenance', signedIn, async (req, res) => {
    const query = parseInput(provenanceQuery, req.query, 'The provenance parameters are not valid.');
    const { model } = await authorizeModel(req, req.params.id, 'read');
    // A plain read: provenance needs no findings, so the club rules' hook is not asked.
    const [row] = await sequelize.query<{ number: number; document: unknown }>(
      `SELECT number, document FROM revisions WHERE model_id = $model ${query.revision ? 'AND id = $revision' : ''}
        ORDER BY number DESC LIMIT 1`,
      { bind: { model: model.id, ...(query.revision ? { revision: query.revision } : {}) }, type: QueryTypes.SELECT },
    );
    const revision = row && { modelId: model.id, number: row.number, document: row.document };
    if (!revision) throw new NotFound('This model has no such revision.', { code: 'revision-not-found' });
    res.json({ data: await provenanceOf(sequelize, revision, query.path) });
  });

  // The earlier history of one setting: every revision that changed it, newest first.
  router.get('/models/:id/provenance/history', signedIn, async (req, res) => {
    const query = parseInput(historyQuery, req.query, 'The history needs the setting’s path.');
    const { model } = await authorizeModel(req, req.params.id, 'read');
    const { changes, total } = await historyOf(sequelize, model.id, query.path, query);
    res.json({ data: changes, pagination: pagination(query, total) });
  });

  router.get('/models/:id/source-updates', signedIn, async (req, res) => {
    const { model } = await authorizeModel(req, req.params.id, 'read');
    const sides = await mergeSides(model);
    // The source is read only by members of its workspace, as everywhere else.
    await authorizeModel(req, sides.source.id, 'read');
    res.json({ data: presentSourceUpdates(sides) });
  });

  router.post('/models/:id/source-updates', signedIn, async (req, res) => {
    const input = parseInput(takeInSchema, req.body, 'The merge needs the base revision number and the chosen sides.');
    const { model } = await authorizeModel(req, req.params.id, 'edit');
    const sides = await mergeSides(model);
    await authorizeModel(req, sides.source.id, 'read');
    const revision = await takeInSource(sequelize, {
      fork: model,
      author: currentUser(req),
      base: input.base,
      resolutions: input.resolutions,
      message: input.message,
    });
    res.status(201).json({ data: presentSavedRevision(revision) });
  });

  return router;
}
