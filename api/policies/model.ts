import type { Request } from 'express';
import type { Transaction } from 'sequelize';
import { NotFound } from '../errors';
import { Revision, SetupModel } from '../models';
import { idSchema } from '../validation';
import type { Role } from './roles';
import { requireRole, type WorkspaceAccess } from './workspace';

// What each action on models and revisions needs, in one place. Viewers and reviewers
// read everything; editors and owners change models and their histories; the audit
// trail is for owners.
export const MODEL_POLICY = {
  read: 'viewer',
  create: 'editor',
  edit: 'editor',
  audit: 'owner',
} as const satisfies Record<string, Role>;

export type ModelAction = keyof typeof MODEL_POLICY;

export interface ModelAccess extends WorkspaceAccess {
  model: SetupModel;
}

export interface RevisionAccess extends ModelAccess {
  revision: Revision;
}

/** The caller's access to a workspace for an action on its models. */
export function authorizeWorkspace(req: Request, workspaceId: unknown, action: ModelAction): Promise<WorkspaceAccess> {
  return requireRole(req, workspaceId, MODEL_POLICY[action]);
}

// A record in a workspace the caller does not belong to answers exactly like one
// that does not exist.
async function accessTo(req: Request, workspaceId: string, action: ModelAction, notFound: NotFound): Promise<WorkspaceAccess> {
  try {
    return await authorizeWorkspace(req, workspaceId, action);
  } catch (error) {
    throw error instanceof NotFound ? notFound : error;
  }
}

export async function authorizeModel(req: Request, modelId: unknown, action: ModelAction, transaction?: Transaction): Promise<ModelAccess> {
  const notFound = new NotFound('No such model.', { code: 'model-not-found' });
  const id = idSchema.safeParse(modelId);
  if (!id.success) throw notFound;
  const model = await SetupModel.findByPk(id.data, { transaction });
  if (!model) throw notFound;
  return { ...(await accessTo(req, model.workspaceId, action, notFound)), model };
}

/** Loads the revision with its model; `full` includes the YAML text, document and findings. */
export async function authorizeRevision(req: Request, revisionId: unknown, action: ModelAction, options: { full?: boolean } = {}): Promise<RevisionAccess> {
  const notFound = new NotFound('No such revision.', { code: 'revision-not-found' });
  const id = idSchema.safeParse(revisionId);
  if (!id.success) throw notFound;
  const revision = await Revision.findByPk(id.data, {
    attributes: options.full ? undefined : { exclude: ['yamlText', 'document', 'findings'] },
    include: [{ model: SetupModel, as: 'model', required: true }],
  });
  if (!revision?.model) throw notFound;
  return { ...(await accessTo(req, revision.model.workspaceId, action, notFound)), model: revision.model, revision };
}
