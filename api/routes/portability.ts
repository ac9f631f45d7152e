import { Router, type Request, type Response } from 'express';
import multer from 'multer';
import { z } from 'zod';
import type { AppContext } from '../context';
import { BadRequest, NotFound, Unprocessable, UnsupportedMediaType } from '../errors';
import { authenticate, currentUser } from '../middleware/authenticate';
import { uploadError } from '../middleware/upload-error';
import { SetupModel } from '../models';
import { modelPolicy } from '../policies/model';
import { authorizeModel, authorizeWorkspace } from './authorize';
import { loadExportModels, folderSlug } from '../portability/export-data';
import { exportHistoryBundle } from '../portability/export-history';
import { findImportJob, listImportJobs, queueImportJob } from '../portability/import-jobs';
import { MAX_BUNDLE_BYTES } from '../portability/import-limits';
import { importJobSignals } from '../portability/import-worker';
import { presentImportJobs } from '../queries/import-job-views';
import { sendAsDownload } from '../security/content-disposition';
import { idSchema, parseInput } from '../validation';
import { modelName } from './model-inputs';

// History export and import as git bundles (see portability/export-history.ts):
// `git clone tern-1800.bundle` gives a plain repository with setup.yaml and the history.
// An import is a job (portability/import-worker.ts): the upload is checked for what is
// cheap to see (its size, that it is a bundle), queued, and answered with 202 and the
// job, which the job routes show until it is done or failed.
const BUNDLE_SIGNATURE = /^# v[23] git bundle\n/;

const importFields = z.strictObject({ name: modelName.optional() });

const parser = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_BUNDLE_BYTES, files: 1, fields: 2, fieldSize: 1024, parts: 3, fieldNestingDepth: 0 },
  defParamCharset: 'utf8',
}).single('file');

const BUNDLE_LIMIT = {
  bytes: MAX_BUNDLE_BYTES,
  tooLarge: `The file is larger than ${MAX_BUNDLE_BYTES / 1024 / 1024} MB.`,
};

const HEADER_LINE = /^(?:[0-9a-f]{40}|[0-9a-f]{64}) \S+$/;
const MAX_HEADER_BYTES = 1024 * 1024;

/**
 * The bundle's header (its refs, then an empty line, then the pack) read here, before
 * the job is queued: a file cut short or with another repository's commits missing
 * is refused now rather than by the worker.
 */
function checkBundleHeader(bundle: Buffer): void {
  const refused = (reason: string) =>
    new Unprocessable(
      `This file is not a git bundle Bindery can read (${reason}). Upload the .bundle file a history export gave you.`,
      { code: 'not-a-git-bundle' },
    );
  const end = bundle.subarray(0, MAX_HEADER_BYTES).indexOf('\n\n');
  if (end < 0) throw refused('its list of branches does not end');
  const [, ...lines] = bundle.subarray(0, end).toString('latin1').split('\n');
  if (lines.some((line) => line.startsWith('-'))) throw refused('it needs commits from another repository');
  const refs = lines.filter((line) => !line.startsWith('@'));
  if (refs.length === 0 || !refs.every((line) => HEADER_LINE.test(line)))
    throw refused('its list of branches is garbled');
  if (bundle.subarray(end + 2, end + 6).toString('latin1') !== 'PACK') throw refused('it holds no pack of commits');
}

async function readBundleUpload(
  req: Request,
  res: Response,
): Promise<{ bundle: Buffer; fileName: string; fields: Record<string, unknown> }> {
  if (!req.is('multipart/form-data')) {
    throw new UnsupportedMediaType(
      'Upload the export as multipart/form-data with the .bundle file in the field "file".',
      { details: { content_type: req.get('content-type') ?? null } },
    );
  }
  await new Promise<void>((resolve, reject) =>
    parser(req, res, (error?: unknown) => (error ? reject(uploadError(error, BUNDLE_LIMIT)) : resolve())),
  );
  if (!req.file)
    throw new BadRequest('No file arrived: put the .bundle file in the form field named "file".', {
      code: 'file-missing',
    });
  if (!BUNDLE_SIGNATURE.test(req.file.buffer.subarray(0, 20).toString('latin1'))) {
    throw new UnsupportedMediaType(
      'This file is not a git bundle. Upload the .bundle file a history export gave you.',
      { code: 'not-a-git-bundle' },
    );
  }
  checkBundleHeader(req.file.buffer);
  return {
    bundle: req.file.buffer,
    fileName: req.file.originalname.replace(/[\u0000-\u001f\u007f]/g, '').slice(0, 255),
    fields: (req.body ?? {}) as Record<string, unknown>,
  };
}

function sendBundle(res: Response, name: string, bundle: Buffer): void {
  sendAsDownload(res, `${name}.bundle`);
  res.type('application/x-git-bundle');
  res.set('Cache-Control', 'private, no-store');
  res.send(bundle);
}

export function portabilityRouter({ sequelize, config }: AppContext): Router {
  const router = Router();
  const signedIn = authenticate(config);

  router.get('/models/:id/export.git', signedIn, async (req, res) => {
    const { model } = await authorizeModel(req, req.params.id, 'read');
    sendBundle(
      res,
      folderSlug(model.name),
      await exportHistoryBundle(await loadExportModels(sequelize, [model], false)),
    );
  });

  router.get('/workspaces/:ws/export.git', signedIn, async (req, res) => {
    const { workspace } = await authorizeWorkspace(req, req.params.ws, modelPolicy, 'read');
    const models = await SetupModel.findAll({
      where: { workspaceId: workspace.id },
      order: [
        ['createdAt', 'ASC'],
        ['id', 'ASC'],
      ],
    });
    sendBundle(
      res,
      `${folderSlug(workspace.name)}-workspace`,
      await exportHistoryBundle(await loadExportModels(sequelize, models, true)),
    );
  });

  router.post('/workspaces/:ws/import', signedIn, async (req, res) => {
    const { workspace, role } = await authorizeWorkspace(req, req.params.ws, modelPolicy, 'create');
    const upload = await readBundleUpload(req, res);
    const fields = parseInput(importFields, upload.fields, 'Some form fields need attention.');
    const user = currentUser(req);
    const id = await queueImportJob(sequelize, {
      workspaceId: workspace.id,
      requestedBy: user.id,
      fileName: upload.fileName,
      modelName: fields.name ?? null,
      bundle: upload.bundle,
    });
    // Read before the worker is told, so the answer shows the job as it was queued.
    const [job] = await presentImportJobs([(await findImportJob(sequelize, workspace.id, id))!], role, user);
    importJobSignals.emit('queued');
    res.status(202).location(`/api/workspaces/${workspace.id}/imports/${id}`).json({ data: job });
  });

  router.get('/workspaces/:ws/imports', signedIn, async (req, res) => {
    const { workspace, role } = await authorizeWorkspace(req, req.params.ws, modelPolicy, 'create');
    const jobs = await listImportJobs(sequelize, workspace.id, 50);
    res.json({ data: await presentImportJobs(jobs, role, currentUser(req)) });
  });

  router.get('/workspaces/:ws/imports/:id', signedIn, async (req, res) => {
    const { workspace, role } = await authorizeWorkspace(req, req.params.ws, modelPolicy, 'create');
    const id = idSchema.safeParse(req.params.id);
    const job = id.success ? await findImportJob(sequelize, workspace.id, id.data) : null;
    if (!job) throw new NotFound('There is no such import in this workspace.', { code: 'import-not-found' });
    const [presented] = await presentImportJobs([job], role, currentUser(req));
    res.json({ data: presented });
  });

  return router;
}
