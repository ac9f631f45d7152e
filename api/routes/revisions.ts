import { Router, type Request, type Response } from 'express';
import { Op } from 'sequelize';
import { z } from 'zod';
import { jsonPatch } from '@shared/diff';
import { revertRevision } from '../commands/revert-revision';
import { checkSetupText, type CheckedSetup } from '../revisions/check-setup';
import { saveRevisionAtOnce } from '../commands/save-revision-at-once';
import { tagNamesOf, tagRevision, untagRevision } from '../commands/tag-revision';
import type { AppContext } from '../context';
import { NotFound } from '../errors';
import { authenticate, currentUser } from '../middleware/authenticate';
import { Revision, User, type SetupModel } from '../models';
import { authorizeModel, authorizeRevision } from './authorize';
import { revisionFileName } from '../presenters/download-name';
import { sendAsDownload } from '../security/content-disposition';
import { presentRevision, presentRevisionSummary, presentSavedRevision } from '../presenters/revision';
import { recordChangesLater } from '../provenance/record-later';
import { SUMMARY_ATTRIBUTES, tagsByRevision } from '../queries/model-views';
import { parseInput } from '../validation';
import { historyQuery, patchQuery, revertSchema, saveRevisionSchema, tagName, tagSchema } from './model-inputs';

const revisionQuery = z.object({
  format: z.enum(['json', 'yaml'], { error: 'format is json or yaml.' }).default('json'),
  download: z.enum(['0', '1', 'true', 'false'], { error: 'download is 1 or 0.' }).optional(),
});

const wantsDownload = (value: string | undefined): boolean => value === '1' || value === 'true';

/** The exact stored text, byte for byte, optionally as a file to save. */
function sendYaml(res: Response, model: SetupModel, revision: Revision, download: boolean): void {
  if (download) sendAsDownload(res, revisionFileName(model.name, revision.number));
  res.type('application/yaml; charset=utf-8');
  res.send(Buffer.from(revision.yamlText, 'utf8'));
}

/**
 * Reads and checks the text before the save's one statement (which checks the caller's
 * role itself). When the text is refused, the caller's access is checked first, so a
 * stranger still gets 404 and a viewer 403, never the text's refusal.
 */
async function checkedForEditor(req: Request, modelId: unknown, yaml: string): Promise<CheckedSetup> {
  try {
    return checkSetupText(yaml);
  } catch (error) {
    await authorizeModel(req, modelId, 'edit');
    throw error;
  }
}

export function revisionsRouter({ sequelize, config }: AppContext): Router {
  const router = Router();
  const signedIn = authenticate(config);

  router.post('/models/:id/revisions', signedIn, async (req, res) => {
    const input = parseInput(saveRevisionSchema, req.body);
    const revision = await saveRevisionAtOnce(sequelize, {
      modelId: req.params.id,
      author: currentUser(req),
      base: input.base,
      setup: await checkedForEditor(req, req.params.id, input.yaml),
      message: input.message ?? '',
      origin: 'save',
    });
    res.status(201).json({ data: presentSavedRevision(revision) });
    recordChangesLater(sequelize, revision.modelId, config);
  });

  router.get('/models/:id/revisions', signedIn, async (req, res) => {
    const { limit, before } = parseInput(historyQuery, req.query, 'The paging parameters are not valid.');
    const { model } = await authorizeModel(req, req.params.id, 'read');
    const rows = await Revision.findAll({
      where: { modelId: model.id, ...(before !== undefined ? { number: { [Op.lt]: before } } : {}) },
      attributes: SUMMARY_ATTRIBUTES,
      include: [{ model: User, as: 'author', attributes: ['id', 'name'] }],
      order: [['number', 'DESC']],
      limit: limit + 1,
    });
    const page = rows.slice(0, limit);
    const tags = await tagsByRevision(page.map((revision) => revision.id));
    res.json({
      data: page.map((revision) => presentRevisionSummary(revision, tags.get(revision.id) ?? [])),
      pagination: {
        limit,
        before: before ?? null,
        next_before: rows.length > limit ? page[page.length - 1].number : null,
      },
    });
  });

  router.get('/models/:id/revisions/:number', signedIn, async (req, res) => {
    const query = parseInput(revisionQuery, req.query, 'The parameters are not valid.');
    const { model } = await authorizeModel(req, req.params.id, 'read');
    const raw = String(req.params.number);
    const number = /^\d{1,10}$/.test(raw) ? Number(raw) : NaN;
    const revision = Number.isSafeInteger(number)
      ? await Revision.findOne({
          where: { modelId: model.id, number },
          include: [{ model: User, as: 'author', attributes: ['id', 'name'] }],
        })
      : null;
    if (!revision) throw new NotFound(`This model has no revision ${raw}.`, { code: 'revision-not-found' });
    if (query.format === 'yaml' || wantsDownload(query.download))
      return sendYaml(res, model, revision, wantsDownload(query.download));
    res.json({ data: presentRevision(revision, await tagNamesOf(revision.id)) });
  });

  router.get('/revisions/:id', signedIn, async (req, res) => {
    const query = parseInput(revisionQuery, req.query, 'The parameters are not valid.');
    const { model, revision } = await authorizeRevision(req, req.params.id, 'read', { full: true });
    if (query.format === 'yaml' || wantsDownload(query.download))
      return sendYaml(res, model, revision, wantsDownload(query.download));
    const [tags, author] = await Promise.all([
      tagNamesOf(revision.id),
      User.findByPk(revision.authorId, { attributes: ['id', 'name'] }),
    ]);
    revision.author = author ?? undefined;
    res.json({
      data: {
        ...presentRevision(revision, tags),
        model: { id: model.id, name: model.name, workspace_id: model.workspaceId },
      },
    });
  });

  router.post('/models/:id/revert', signedIn, async (req, res) => {
    const input = parseInput(revertSchema, req.body);
    const { model } = await authorizeModel(req, req.params.id, 'edit');
    const revision = await revertRevision(sequelize, { modelId: model.id, author: currentUser(req), ...input });
    res.status(201).json({ data: presentSavedRevision(revision) });
  });

  router.post('/revisions/:id/tags', signedIn, async (req, res) => {
    const { name } = parseInput(tagSchema, req.body);
    const { model, revision } = await authorizeRevision(req, req.params.id, 'edit');
    const { created } = await tagRevision(sequelize, { model, revision, author: currentUser(req), name });
    res
      .status(created ? 201 : 200)
      .json({ data: { revision_id: revision.id, number: revision.number, tags: await tagNamesOf(revision.id) } });
  });

  router.delete('/revisions/:id/tags/:name', signedIn, async (req, res) => {
    const name = parseInput(tagName, req.params.name, 'That is not a tag name.');
    const { model, revision } = await authorizeRevision(req, req.params.id, 'edit');
    await untagRevision(sequelize, { model, revision, author: currentUser(req), name });
    res.json({ data: { revision_id: revision.id, number: revision.number, tags: await tagNamesOf(revision.id) } });
  });

  router.get('/revisions/:id/patch', signedIn, async (req, res) => {
    const query = parseInput(patchQuery, req.query, 'The parameters are not valid.');
    const [from, to] = await Promise.all([
      authorizeRevision(req, query.from, 'read', { full: true }),
      authorizeRevision(req, req.params.id, 'read', { full: true }),
    ]);
    const operations = jsonPatch(from.revision.document, to.revision.document);
    if (wantsDownload(query.download)) {
      const name = revisionFileName(to.model.name, to.revision.number, '.patch.json').replace(
        /-r(\d+)\.patch\.json$/,
        `-r${from.revision.number}-to-r$1.patch.json`,
      );
      sendAsDownload(res, name);
      res.type('application/json-patch+json; charset=utf-8');
      return res.send(JSON.stringify(operations, null, 2));
    }
    res.json({ data: operations });
  });

  return router;
}
