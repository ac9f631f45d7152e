import type { Transaction } from 'sequelize';
import type { Role } from '@shared/contract/roles';
import { Receiver, Review, ReviewComment, Revision, SetupModel, type Workspace } from '../models';
import { callerMembershipJoin, callerRole, loadMembership } from './membership';

// Each loader reads a record and the caller's role in its workspace (null when the
// caller is not a member); null for no such record. They decide nothing: the routes
// hand the role to a policy (api/policies/) and answer its "no".

export interface ModelAccess {
  model: SetupModel;
  role: Role | null;
}

export interface RevisionAccess extends ModelAccess {
  revision: Revision;
}

export interface ReceiverAccess {
  receiver: Receiver;
  workspace: Workspace | null;
  role: Role | null;
}

export interface ReviewAccess {
  review: Review & { revision: Revision; model: SetupModel };
  workspace: Workspace | null;
  role: Role | null;
}

/** The model and the caller's role, in one statement (it is on the path of every save). */
export async function loadModel(callerId: string, modelId: string): Promise<ModelAccess | null> {
  const caller = callerMembershipJoin('m.workspace_id');
  const [model] = await SetupModel.sequelize!.query(
    `SELECT m.*, ${caller.select} FROM models m ${caller.join} WHERE m.id = $id`,
    {
      bind: { id: modelId, callerId },
      model: SetupModel,
      mapToModel: true,
    },
  );
  return model ? { model, role: callerRole(model) } : null;
}

export type LargeField = 'yamlText' | 'document' | 'findings';
const LARGE_FIELDS: readonly LargeField[] = ['yamlText', 'document', 'findings'];

/**
 * The revision with its model; `full` includes the YAML text, document and findings,
 * `fields` only the ones named (each is read, sent and parsed only if needed).
 */
export async function loadRevision(
  callerId: string,
  revisionId: string,
  options: { full?: boolean; fields?: readonly LargeField[] } = {},
): Promise<RevisionAccess | null> {
  const revision = await Revision.findByPk(revisionId, {
    attributes: options.full
      ? undefined
      : { exclude: LARGE_FIELDS.filter((field) => !options.fields?.includes(field)) },
    include: [{ model: SetupModel, as: 'model', required: true }],
  });
  if (!revision?.model) return null;
  const member = await loadMembership(callerId, revision.model.workspaceId);
  return { model: revision.model, revision, role: member?.role ?? null };
}

export async function loadReceiver(callerId: string, receiverId: string): Promise<ReceiverAccess | null> {
  const receiver = await Receiver.findByPk(receiverId);
  if (!receiver) return null;
  const member = await loadMembership(callerId, receiver.workspaceId);
  return { receiver, workspace: member?.workspace ?? null, role: member?.role ?? null };
}

/** The review with its revision (in full) and model. */
export async function loadReview(callerId: string, reviewId: string): Promise<ReviewAccess | null> {
  const review = await Review.findByPk(reviewId, {
    include: [
      { model: Revision, as: 'revision', required: true },
      { model: SetupModel, as: 'model', required: true },
    ],
  });
  if (!review?.revision || !review.model) return null;
  const member = await loadMembership(callerId, review.workspaceId);
  return {
    review: review as ReviewAccess['review'],
    workspace: member?.workspace ?? null,
    role: member?.role ?? null,
  };
}

export interface CommentAccess {
  comment: ReviewComment & { revision: Revision; model: SetupModel };
  workspace: Workspace | null;
  role: Role | null;
}

/** A comment with its revision (in full, for presenting its thread) and model. */
export async function loadComment(callerId: string, commentId: string): Promise<CommentAccess | null> {
  const comment = await ReviewComment.findByPk(commentId, {
    include: [
      { model: Revision, as: 'revision', required: true },
      { model: SetupModel, as: 'model', required: true },
    ],
  });
  if (!comment?.revision || !comment.model) return null;
  const member = await loadMembership(callerId, comment.model.workspaceId);
  return {
    comment: comment as CommentAccess['comment'],
    workspace: member?.workspace ?? null,
    role: member?.role ?? null,
  };
}

/** A model of the given workspace: a unit goes only into the hangar its shelf belongs to. */
export function loadModelInWorkspace(
  workspaceId: string,
  modelId: string,
  transaction?: Transaction,
): Promise<SetupModel | null> {
  return SetupModel.findOne({ where: { id: modelId, workspaceId }, transaction });
}

/** What a route hands on once the policy said yes: the caller is a member with this role. */
export type Granted<T extends { role: Role | null }> = Omit<T, 'role' | 'workspace'> & {
  role: Role;
  workspace: Workspace;
};
export type GrantedReview = Granted<ReviewAccess>;
