import type { Request } from 'express';
import type { Role } from '@shared/contract/roles';
import { loadMembership, type Member } from '../access/membership';
import {
  loadComment,
  loadModel,
  loadModelInWorkspace,
  loadReceiver,
  loadReview,
  loadRevision,
  type CommentAccess,
  type Granted,
  type GrantedReview,
  type LargeField,
  type ModelAccess,
  type ReceiverAccess,
  type RevisionAccess,
} from '../access/records';
import { NotFound, roleTooLow } from '../errors';
import { currentUser } from '../middleware/authenticate';
import type { SetupModel } from '../models';
import type { Decision } from '../policies/decision';
import { modelPolicy, type ModelAction } from '../policies/model';
import { receiverPolicy, type ReceiverAction } from '../policies/receiver';
import { reviewPolicy, type ReviewAction } from '../policies/review';
import { workspacePolicy, type MemberRecord, type WorkspaceAction } from '../policies/workspace';
import { idSchema } from '../validation';

// Load, decide, answer: each guard reads the record and the caller's role through
// api/access/, asks the pure policy, and turns its "no" into the HTTP answer. A record
// of a workspace the caller is not in answers exactly like one that does not exist
// (404); a role too low answers 403 with the role it needs.

/** Throws the answer to a "no"; returns the role a "yes" was given for. */
function enforce(decision: Decision, role: Role | null, notFound: () => NotFound): Role {
  if (decision.allowed && role) return role;
  if (!decision.allowed && decision.reason === 'role-too-low') throw roleTooLow(decision.required, decision.role);
  throw notFound();
}

function idOrNotFound(value: unknown, notFound: () => NotFound): string {
  const id = idSchema.safeParse(value);
  if (!id.success) throw notFound();
  return id.data;
}

const workspaceNotFound = () => new NotFound('No such workspace.', { code: 'workspace-not-found' });
const modelNotFound = () => new NotFound('No such model.', { code: 'model-not-found' });
const revisionNotFound = () => new NotFound('No such revision.', { code: 'revision-not-found' });
const receiverNotFound = () => new NotFound('No such receiver.', { code: 'receiver-not-found' });
const reviewNotFound = () => new NotFound('No such review.', { code: 'review-not-found' });
const commentNotFound = () => new NotFound('No such comment.', { code: 'comment-not-found' });

/** The workspace for an action under the policy that owns it (the workspace's own, the models', the shelf's, the reviews'). */
export async function authorizeWorkspace<A>(
  req: Request,
  workspaceId: unknown,
  policy: (role: Role | null, action: A, record?: MemberRecord) => Decision,
  action: A,
  record?: MemberRecord,
): Promise<Member> {
  const id = idOrNotFound(workspaceId, workspaceNotFound);
  const member = await loadMembership(currentUser(req).id, id);
  const role = enforce(policy(member?.role ?? null, action, record), member?.role ?? null, workspaceNotFound);
  return { workspace: member!.workspace, role };
}

export function authorizeWorkspaceAction(
  req: Request,
  workspaceId: unknown,
  action: WorkspaceAction,
  record?: MemberRecord,
) {
  return authorizeWorkspace(req, workspaceId, workspacePolicy, action, record);
}

export async function authorizeModel(
  req: Request,
  modelId: unknown,
  action: ModelAction,
): Promise<ModelAccess & { role: Role }> {
  const loaded = await loadModel(currentUser(req).id, idOrNotFound(modelId, modelNotFound));
  if (!loaded) throw modelNotFound();
  return { ...loaded, role: enforce(modelPolicy(loaded.role, action), loaded.role, modelNotFound) };
}

export async function authorizeRevision(
  req: Request,
  revisionId: unknown,
  action: ModelAction,
  options: { full?: boolean; fields?: readonly LargeField[] } = {},
): Promise<RevisionAccess & { role: Role }> {
  const loaded = await loadRevision(currentUser(req).id, idOrNotFound(revisionId, revisionNotFound), options);
  if (!loaded) throw revisionNotFound();
  return { ...loaded, role: enforce(modelPolicy(loaded.role, action), loaded.role, revisionNotFound) };
}

/**
 * Two revisions read in one statement (a compare's sides, api/queries/compare-sides.ts),
 * each decided exactly as `authorizeRevision` decides one: a bad id, a missing revision
 * and one the caller may not see all answer the same 404, the "from" side first.
 */
export async function authorizeRevisionPair<Side extends { role: Role | null }>(
  req: Request,
  revisionIds: readonly [unknown, unknown],
  action: ModelAction,
  load: (callerId: string, ids: readonly [string, string]) => Promise<[Side | undefined, Side | undefined]>,
): Promise<[Side & { role: Role }, Side & { role: Role }]> {
  const ids = [idOrNotFound(revisionIds[0], revisionNotFound), idOrNotFound(revisionIds[1], revisionNotFound)] as const;
  const grant = (side: Side | undefined): Side & { role: Role } => {
    if (!side) throw revisionNotFound();
    return { ...side, role: enforce(modelPolicy(side.role, action), side.role, revisionNotFound) };
  };
  const [from, to] = await load(currentUser(req).id, ids);
  return [grant(from), grant(to)];
}

export async function authorizeReceiver(
  req: Request,
  receiverId: unknown,
  action: ReceiverAction,
): Promise<Granted<ReceiverAccess>> {
  const loaded = await loadReceiver(currentUser(req).id, idOrNotFound(receiverId, receiverNotFound));
  if (!loaded) throw receiverNotFound();
  const role = enforce(receiverPolicy(loaded.role, action), loaded.role, receiverNotFound);
  return { ...loaded, role, workspace: loaded.workspace! };
}

export async function authorizeReview(req: Request, reviewId: unknown, action: ReviewAction): Promise<GrantedReview> {
  const loaded = await loadReview(currentUser(req).id, idOrNotFound(reviewId, reviewNotFound));
  if (!loaded) throw reviewNotFound();
  const role = enforce(reviewPolicy(loaded.role, action), loaded.role, reviewNotFound);
  return { ...loaded, role, workspace: loaded.workspace! };
}

/** A comment of a thread, under the reviews' policy (threads on a revision outside a review too). */
export async function authorizeComment(
  req: Request,
  commentId: unknown,
  action: ReviewAction,
): Promise<Granted<CommentAccess>> {
  const loaded = await loadComment(currentUser(req).id, idOrNotFound(commentId, commentNotFound));
  if (!loaded) throw commentNotFound();
  const role = enforce(reviewPolicy(loaded.role, action), loaded.role, commentNotFound);
  return { ...loaded, role, workspace: loaded.workspace! };
}

/** A model of the receiver's own workspace: a unit goes only into the hangar its shelf belongs to. */
export async function modelOnShelf(workspaceId: string, modelId: string): Promise<SetupModel> {
  const model = await loadModelInWorkspace(workspaceId, modelId);
  if (!model) throw new NotFound('No such model in this workspace.', { code: 'model-not-found' });
  return model;
}
