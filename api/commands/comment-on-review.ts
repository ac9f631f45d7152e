import type { Sequelize } from 'sequelize';
import { Unprocessable } from '../errors';
import { ReviewComment, type User } from '../models';
import type { GrantedReview } from '../access/records';
import { anchorExists, readAnchor } from '../reviews/anchor-path';
import { recordAuditEvent } from '../audit/record-audit-event';

export interface CommentInput {
  body: string;
  /** A semantic path into the reviewed revision the comment is anchored to; absent for the whole revision. */
  path?: string;
}

/** Refuses an anchor that cannot be read, or that names nothing in the reviewed revision. */
function requireAnchor(review: GrantedReview['review'], path: string): void {
  if (!readAnchor(path)) {
    throw new Unprocessable('The path is not a semantic path Bindery can read, like receivers[id=wing].map[pin=3].', {
      code: 'invalid-path',
      details: { fields: { path: 'Write the path like receivers[id=wing].map[pin=3].' } },
    });
  }
  if (!anchorExists(review.revision.document, path)) {
    throw new Unprocessable(`Nothing in revision ${review.revision.number} is at ${path}.`, {
      code: 'path-not-found',
      details: { fields: { path: 'This path does not exist in the reviewed revision.' } },
    });
  }
}

/** A comment on the review's revision, with its entry in the audit trail. */
export async function commentOnReview(
  sequelize: Sequelize,
  input: { review: GrantedReview['review']; author: User } & CommentInput,
): Promise<ReviewComment> {
  const { review, author } = input;
  if (input.path !== undefined) requireAnchor(review, input.path);
  const comment = await sequelize.transaction(async (transaction) => {
    const created = await ReviewComment.create(
      {
        reviewId: review.id,
        revisionId: review.revision.id,
        modelId: review.modelId,
        path: input.path ?? null,
        body: input.body,
        authorId: author.id,
      },
      { transaction },
    );
    await recordAuditEvent(
      {
        workspaceId: review.workspaceId,
        actor: author,
        action: 'review.commented',
        subjectType: 'review',
        subjectId: review.id,
        details: {
          model_id: review.model.id,
          model_name: review.model.name,
          number: review.revision.number,
          path: created.path,
        },
      },
      transaction,
    );
    return created;
  });
  comment.revision = review.revision;
  return comment;
}
