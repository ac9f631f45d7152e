import type { Request } from 'express';
import type { Transaction } from 'sequelize';
import { NotFound } from '../errors';
import { Review, ReviewComment, Revision, SetupModel } from '../models';
import { idSchema } from '../validation';
import type { Role } from '@shared/contract/roles';
import { requireRole, type WorkspaceAccess } from './workspace';

// What each action on reviews needs. Everyone reads reviews; editors (and owners) ask
// for them; reviewers and above give verdicts, tick the checklist and comment.
export const REVIEW_POLICY = {
  read: 'viewer',
  request: 'editor',
  verdict: 'reviewer',
  tick: 'reviewer',
  comment: 'reviewer',
} as const satisfies Record<string, Role>;

export type ReviewAction = keyof typeof REVIEW_POLICY;

export interface ReviewAccess extends WorkspaceAccess {
  review: Review & { revision: Revision; model: SetupModel };
}

/** Loads the review with its revision (in full) and model; 404 outside the caller's workspaces. */
export async function authorizeReview(
  req: Request,
  reviewId: unknown,
  action: ReviewAction,
  transaction?: Transaction,
): Promise<ReviewAccess> {
  const notFound = new NotFound('No such review.', { code: 'review-not-found' });
  const id = idSchema.safeParse(reviewId);
  if (!id.success) throw notFound;
  const review = await Review.findByPk(id.data, {
    include: [
      { model: Revision, as: 'revision', required: true },
      { model: SetupModel, as: 'model', required: true },
    ],
    transaction,
    ...(transaction ? { lock: { level: transaction.LOCK.UPDATE, of: Review } } : {}),
  });
  if (!review?.revision || !review.model) throw notFound;
  try {
    const access = await requireRole(req, review.workspaceId, REVIEW_POLICY[action]);
    return { ...access, review: review as ReviewAccess['review'] };
  } catch (error) {
    throw error instanceof NotFound ? notFound : error;
  }
}

export interface CommentAccess extends WorkspaceAccess {
  comment: ReviewComment & { revision: Revision; model: SetupModel };
}

/** Loads a comment with its revision (in full) and model; 404 outside the caller's workspaces. */
export async function authorizeComment(
  req: Request,
  commentId: unknown,
  action: ReviewAction,
  transaction?: Transaction,
): Promise<CommentAccess> {
  const notFound = new NotFound('No such comment.', { code: 'comment-not-found' });
  const id = idSchema.safeParse(commentId);
  if (!id.success) throw notFound;
  const comment = await ReviewComment.findByPk(id.data, {
    include: [
      { model: Revision, as: 'revision', required: true },
      { model: SetupModel, as: 'model', required: true },
    ],
    transaction,
    ...(transaction ? { lock: { level: transaction.LOCK.UPDATE, of: ReviewComment } } : {}),
  });
  if (!comment?.revision || !comment.model) throw notFound;
  try {
    const access = await requireRole(req, comment.model.workspaceId, REVIEW_POLICY[action]);
    return { ...access, comment: comment as CommentAccess['comment'] };
  } catch (error) {
    throw error instanceof NotFound ? notFound : error;
  }
}
