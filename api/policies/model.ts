import type { Request } from 'express';
import { QueryTypes } from 'sequelize';
import { Forbidden, NotFound } from '../errors';
import { currentUser } from '../middleware/authenticate';
import { Revision, SetupModel } from '../models';
import { idSchema } from '../validation';
import { isRole, roleAtLeast, type Role } from '@shared/contract/roles';
import { requireRole, type WorkspaceAccess } from './workspace';

// What each action on models and revisions needs, in one place. Viewers and reviewers
// read everything; editors and owners change models and their histories; the audit
// trail is for owners.
export const MODEL_POLICY = {
  read: 'viewer',
  create: 'editor',
  edit: 'editor',
  // Threads on a revision outside a review, as in a review (REVIEW_POLICY.comment).
  comment: 'reviewer',
  audit: 'owner',
} as const satisfies Record<string, Role>;

export type ModelAction = keyof typeof MODEL_POLICY;

export interface ModelAccess {
  model: SetupModel;
  /** The caller's role in the model's workspace. */
  role: Role;
}

export interface RevisionAccess extends ModelAccess {
  revision: Revision;
}

/** The caller's access to a workspace for an action on its models. */
export function authorizeWorkspace(req: Request, workspaceId: unknown, action: ModelAction): Promise<WorkspaceAccess> {
  return requireRole(req, workspaceId, MODEL_POLICY[action]);
}

// Worded like the workspace guard's refusal, so every route refuses alike.
function requireAtLeast(role: Role, minimum: Role): void {
  if (!roleAtLeast(role, minimum)) {
    throw new Forbidden(`This needs the ${minimum} role or higher; your role here is ${role}.`, {
      code: 'role-too-low',
      details: { required: minimum, role },
    });
  }
}

async function roleIn(req: Request, workspaceId: string): Promise<Role | null> {
  const [row] = await SetupModel.sequelize!.query<{ role: string }>(
    'SELECT role FROM memberships WHERE workspace_id = $workspaceId AND user_id = $userId',
    {
      bind: { workspaceId, userId: currentUser(req).id },
      type: QueryTypes.SELECT,
    },
  );
  return row && isRole(row.role) ? row.role : null;
}

/**
 * The model and the caller's role in its workspace, read in one statement. A model of
 * a workspace the caller does not belong to answers exactly like one that does not
 * exist (404); a role too low answers 403.
 */
export async function authorizeModel(req: Request, modelId: unknown, action: ModelAction): Promise<ModelAccess> {
  const notFound = new NotFound('No such model.', { code: 'model-not-found' });
  const id = idSchema.safeParse(modelId);
  if (!id.success) throw notFound;
  const [model] = await SetupModel.sequelize!.query(
    `SELECT m.*, ms.role AS caller_role
       FROM models m
       JOIN memberships ms ON ms.workspace_id = m.workspace_id AND ms.user_id = $userId
      WHERE m.id = $id`,
    { bind: { id: id.data, userId: currentUser(req).id }, model: SetupModel, mapToModel: true },
  );
  const role: unknown = model?.get('caller_role' as never);
  if (!model || !isRole(role)) throw notFound;
  requireAtLeast(role, MODEL_POLICY[action]);
  return { model, role };
}

type LargeField = 'yamlText' | 'document' | 'findings';
const LARGE_FIELDS: readonly LargeField[] = ['yamlText', 'document', 'findings'];

/**
 * Loads the revision with its model; `full` includes the YAML text, document and
 * findings, `fields` only the ones named (each is read, sent and parsed only if needed).
 */
export async function authorizeRevision(
  req: Request,
  revisionId: unknown,
  action: ModelAction,
  options: { full?: boolean; fields?: readonly LargeField[] } = {},
): Promise<RevisionAccess> {
  const notFound = new NotFound('No such revision.', { code: 'revision-not-found' });
  const id = idSchema.safeParse(revisionId);
  if (!id.success) throw notFound;
  const revision = await Revision.findByPk(id.data, {
    attributes: options.full
      ? undefined
      : { exclude: LARGE_FIELDS.filter((field) => !options.fields?.includes(field)) },
    include: [{ model: SetupModel, as: 'model', required: true }],
  });
  if (!revision?.model) throw notFound;
  const role = await roleIn(req, revision.model.workspaceId);
  if (!role) throw notFound;
  requireAtLeast(role, MODEL_POLICY[action]);
  return { model: revision.model, role, revision };
}
