import { Router } from 'express';
import { col, fn, literal, Op, type Sequelize, type WhereOptions } from 'sequelize';
import { createModel } from '../commands/create-model';
import { forkModel } from '../commands/fork-model';
import { setModelArchived } from '../commands/archive-model';
import { renameModel } from '../commands/rename-model';
import { saveRevisionAtOnce } from '../commands/save-revision-at-once';
import { checkSetupDocument } from '../revisions/check-setup';
import type { AppContext } from '../context';
import { NotFound } from '../errors';
import { authenticate, currentUser } from '../middleware/authenticate';
import { readSetupUpload } from '../middleware/setup-upload';
import { Revision, SetupModel } from '../models';
import { modelPolicy } from '../policies/model';
import { authorizeModel, authorizeWorkspace } from './authorize';
import { recordChangesLater } from '../provenance/record-later';
import { presentSavedRevision } from '../presenters/revision';
import { afterRow } from '../queries/keyset-page';
import { presentModels, presentOneModel } from '../queries/model-views';
import { parseInput } from '../validation';
import { pagination } from './paging';
import {
  createModelSchema,
  forkSchema,
  hangarQuery,
  renameModelSchema,
  uploadModelFields,
  uploadRevisionFields,
} from './model-inputs';

const escapeLike = (text: string): string => text.replace(/[\\%_]/g, '\\$&');

// The hangar's search: a model's name, its airframe, or the name of the author of its
// latest revision, so a pilot finds the models a clubmate last changed. The author is
// looked up for each model the page's index walk reads (its latest revision by the
// (model_id, number) index, that revision's user by id), never by scanning revisions.
function hangarSearch(sequelize: Sequelize, q: string): WhereOptions<SetupModel> {
  const pattern = `%${escapeLike(q)}%`;
  const latestAuthor = `(SELECT u.name FROM revisions r LEFT JOIN users u ON u.id = r.author_id
      WHERE r.model_id = "SetupModel"."id" ORDER BY r.number DESC LIMIT 1)`;
  return {
    [Op.or]: [
      { name: { [Op.iLike]: pattern } },
      { airframe: { [Op.iLike]: pattern } },
      literal(`${latestAuthor} ILIKE ${sequelize.escape(pattern)}`),
    ],
  };
}

/** The model's name for a setup uploaded without one: the setup's own name, else the file's. */
function nameForUpload(data: unknown, fileName: string): string {
  const own = (data as { model?: { name?: unknown } } | null)?.model?.name;
  if (typeof own === 'string' && own.trim().length > 0) return own.trim().slice(0, 80);
  const stem = fileName
    .replace(/\.[^.]*$/, '')
    .replace(/[\u0000-\u001f\u007f]/g, '')
    .trim();
  return stem.length > 0 ? stem.slice(0, 80) : 'Uploaded model';
}

export function modelsRouter({ sequelize, config }: AppContext): Router {
  const router = Router();
  const signedIn = authenticate(config);

  router.get('/workspaces/:ws/models', signedIn, async (req, res) => {
    const { q, limit, offset, after, archived } = parseInput(
      hangarQuery,
      req.query,
      'The search parameters are not valid.',
    );
    const { workspace, role } = await authorizeWorkspace(req, req.params.ws, modelPolicy, 'read');
    const cursor = after ? await afterRow(sequelize, 'models', workspace.id, after) : null;
    const matching: WhereOptions<SetupModel> = { workspaceId: workspace.id };
    if (q) Object.assign(matching, hangarSearch(sequelize, q));
    const archivedOnly = { ...matching, archivedAt: { [Op.ne]: null } };
    const where =
      archived === 'include' ? matching : archived === 'only' ? archivedOnly : { ...matching, archivedAt: null };
    // The total counts the whole filtered hangar; the page starts after the cursor when one is given.
    const [count, rows, archivedCount] = await Promise.all([
      SetupModel.count({ where }),
      SetupModel.findAll({
        where: cursor ? { [Op.and]: [where, cursor] } : where,
        order: [
          [fn('lower', col('name')), 'ASC'],
          ['id', 'ASC'],
        ],
        // One more than asked says whether a page follows.
        limit: limit + 1,
        offset,
      }),
      SetupModel.count({ where: archivedOnly }),
    ]);
    const page = rows.slice(0, limit);
    res.json({
      data: await presentModels(page, role, currentUser(req)),
      pagination: {
        ...pagination({ limit, offset }, count),
        next_after: rows.length > limit ? page[page.length - 1].id : null,
        // How many archived models the search matches, so the hangar can offer to show them.
        archived: archivedCount,
      },
    });
  });

  router.post('/workspaces/:ws/models', signedIn, async (req, res) => {
    const input = parseInput(createModelSchema, req.body);
    const { workspace, role } = await authorizeWorkspace(req, req.params.ws, modelPolicy, 'create');
    const user = currentUser(req);
    const { model, revision } = await createModel(sequelize, { workspace, author: user, ...input });
    res
      .status(201)
      .json({ data: { model: await presentOneModel(model, role, user), revision: presentSavedRevision(revision) } });
  });

  router.post('/workspaces/:ws/models/upload', signedIn, async (req, res) => {
    const { workspace, role } = await authorizeWorkspace(req, req.params.ws, modelPolicy, 'create');
    const upload = await readSetupUpload(req, res);
    const fields = parseInput(uploadModelFields, upload.fields, 'Some form fields need attention.');
    const user = currentUser(req);
    const setup = checkSetupDocument(upload.text);
    const { model, revision } = await createModel(sequelize, {
      workspace,
      author: user,
      name: fields.name ?? nameForUpload(setup.analysis.data, upload.fileName),
      setup,
      message: fields.message || `Uploaded ${upload.fileName}`,
      origin: 'upload',
    });
    res
      .status(201)
      .json({ data: { model: await presentOneModel(model, role, user), revision: presentSavedRevision(revision) } });
  });

  router.get('/models/:id', signedIn, async (req, res) => {
    const { model, role } = await authorizeModel(req, req.params.id, 'read');
    res.json({ data: await presentOneModel(model, role, currentUser(req)) });
  });

  router.patch('/models/:id', signedIn, async (req, res) => {
    const { name } = parseInput(renameModelSchema, req.body);
    const { model, role } = await authorizeModel(req, req.params.id, 'edit');
    const user = currentUser(req);
    const { revision } = await renameModel(sequelize, model, name, user);
    res.json({
      data: await presentOneModel(model, role, user),
      revision: revision ? presentSavedRevision(revision) : null,
    });
  });

  for (const [verb, archived] of [
    ['archive', true],
    ['unarchive', false],
  ] as const) {
    router.post(`/models/:id/${verb}`, signedIn, async (req, res) => {
      const { model, role } = await authorizeModel(req, req.params.id, 'edit');
      const user = currentUser(req);
      await setModelArchived(sequelize, model, archived, user);
      res.json({ data: await presentOneModel(model, role, user) });
    });
  }

  router.post('/models/:id/fork', signedIn, async (req, res) => {
    const input = parseInput(forkSchema, req.body);
    const { model: sourceModel } = await authorizeModel(req, req.params.id, 'read');
    const sourceRevision = await Revision.findOne({ where: { modelId: sourceModel.id, number: input.number } });
    if (!sourceRevision)
      throw new NotFound(`This model has no revision ${input.number}.`, {
        code: 'revision-not-found',
        details: { number: input.number },
      });
    const { workspace, role } = await authorizeWorkspace(req, input.workspace, modelPolicy, 'create');
    const user = currentUser(req);
    const { model, revision } = await forkModel(sequelize, {
      source: { model: sourceModel, revision: sourceRevision },
      workspace,
      author: user,
      name: input.name,
      message: input.message,
    });
    res
      .status(201)
      .json({ data: { model: await presentOneModel(model, role, user), revision: presentSavedRevision(revision) } });
  });

  router.post('/models/:id/upload', signedIn, async (req, res) => {
    const { model } = await authorizeModel(req, req.params.id, 'edit');
    const upload = await readSetupUpload(req, res);
    const fields = parseInput(uploadRevisionFields, upload.fields, 'Some form fields need attention.');
    const revision = await saveRevisionAtOnce(sequelize, {
      modelId: model.id,
      author: currentUser(req),
      base: fields.base,
      setup: checkSetupDocument(upload.text),
      message: fields.message || `Uploaded ${upload.fileName}`,
      origin: 'upload',
    });
    res.status(201).json({ data: presentSavedRevision(revision) });
    recordChangesLater(sequelize, revision.modelId, config);
  });

  return router;
}
