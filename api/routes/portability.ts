import { Router, type Request, type Response } from 'express';
import multer, { MulterError } from 'multer';
import { z } from 'zod';
import type { AppContext } from '../context';
import { BadRequest, TooLarge, UnsupportedMediaType } from '../errors';
import { authenticate, currentUser } from '../middleware/authenticate';
import { SetupModel } from '../models';
import { authorizeModel, authorizeWorkspace } from '../policies/model';
import { loadExportModels, folderSlug } from '../portability/export-data';
import { exportHistoryBundle } from '../portability/export-history';
import { readHistoryBundle } from '../portability/import-history';
import { importModels } from '../portability/import-models';
import { presentOneModel } from '../queries/model-views';
import { sendAsDownload } from '../security/content-disposition';
import { parseInput } from '../validation';
import { modelName } from './model-inputs';

// History export and import as git bundles (see portability/export-history.ts):
// `git clone tern-1800.bundle` gives a plain repository with setup.yaml and the history.

export const MAX_BUNDLE_BYTES = 32 * 1024 * 1024;
const BUNDLE_SIGNATURE = /^# v[23] git bundle\n/;

const importFields = z.strictObject({ name: modelName.optional() });

const parser = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_BUNDLE_BYTES, files: 1, fields: 2, fieldSize: 1024, parts: 3, fieldNestingDepth: 0 },
  defParamCharset: 'utf8',
}).single('file');

function uploadError(error: unknown): unknown {
  if (error instanceof MulterError) {
    if (error.code === 'LIMIT_FILE_SIZE')
      return new TooLarge(`The file is larger than ${MAX_BUNDLE_BYTES / 1024 / 1024} MB.`, {
        details: { limit: MAX_BUNDLE_BYTES },
      });
    return new BadRequest(`The upload form is not acceptable: ${error.message}.`, {
      code: 'invalid-upload',
      details: { reason: error.code },
    });
  }
  return error instanceof Error && !('status' in error)
    ? new BadRequest(`The upload could not be read: ${error.message}.`, { code: 'malformed-upload' })
    : error;
}

async function readBundleUpload(
  req: Request,
  res: Response,
): Promise<{ bundle: Buffer; fields: Record<string, unknown> }> {
  if (!req.is('multipart/form-data')) {
    throw new UnsupportedMediaType(
      'Upload the export as multipart/form-data with the .bundle file in the field "file".',
      { details: { content_type: req.get('content-type') ?? null } },
    );
  }
  await new Promise<void>((resolve, reject) =>
    parser(req, res, (error?: unknown) => (error ? reject(uploadError(error)) : resolve())),
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
  return { bundle: req.file.buffer, fields: (req.body ?? {}) as Record<string, unknown> };
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
    const { workspace } = await authorizeWorkspace(req, req.params.ws, 'read');
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
    const { workspace, role } = await authorizeWorkspace(req, req.params.ws, 'create');
    const upload = await readBundleUpload(req, res);
    const fields = parseInput(importFields, upload.fields, 'Some form fields need attention.');
    const user = currentUser(req);
    const results = await importModels(sequelize, {
      workspace,
      author: user,
      models: await readHistoryBundle(upload.bundle),
      name: fields.name,
    });
    res.status(201).json({
      data: {
        models: await Promise.all(
          results.map(async (result) => ({
            model: await presentOneModel(result.model, role, user),
            revisions: result.revisions,
            tags: result.tags,
            hash_mismatches: result.hashMismatches,
          })),
        ),
      },
    });
  });

  return router;
}
