import type { Sequelize } from 'sequelize';
import { Conflict, Unprocessable } from '../errors';
import { ReviewComment, type Revision, type SetupModel, type User } from '../models';
import { anchorExists, readAnchor } from '../reviews/anchor-path';
import { recordAuditEvent } from '../audit/record-audit-event';

// Comments are threads: a first comment (on the whole revision, or anchored to one
// setting by its semantic path), replies to it, and a resolved mark on the first
// comment that anyone who may comment can set and lift again. Every step is in the
// workspace's audit trail.

interface Where {
  workspaceId: string;
  model: SetupModel;
  revision: Revision;
  reviewId: string | null;
}

/** The anchor checked against the revision: 422 when it is not a path Bindery writes or leads nowhere. */
function checkAnchor(revision: Revision, path: string): void {
  if (!readAnchor(path)) {
    throw new Unprocessable(
      'The setting’s address is not one Bindery can read; start the thread from the setting itself.',
      {
        code: 'invalid-path',
        details: { fields: { path: 'Start the thread by choosing the setting on the review or the Overview.' } },
      },
    );
  }
  if (!anchorExists(revision.document, path)) {
    throw new Unprocessable(`Nothing in revision ${revision.number} is at ${path}.`, {
      code: 'path-not-found',
      details: { fields: { path: 'This setting does not exist in this revision.' } },
    });
  }
}

export async function startThread(
  sequelize: Sequelize,
  where: Where,
  author: User,
  input: { path: string | null; body: string },
): Promise<ReviewComment> {
  if (input.path !== null) checkAnchor(where.revision, input.path);
  return sequelize.transaction(async (transaction) => {
    const created = await ReviewComment.create(
      {
        reviewId: where.reviewId,
        revisionId: where.revision.id,
        modelId: where.model.id,
        path: input.path,
        body: input.body,
        authorId: author.id,
      },
      { transaction },
    );
    await recordAuditEvent(
      {
        workspaceId: where.workspaceId,
        actor: author,
        action: 'review.commented',
        subjectType: where.reviewId ? 'review' : 'revision',
        subjectId: where.reviewId ?? where.revision.id,
        details: {
          model_id: where.model.id,
          model_name: where.model.name,
          number: where.revision.number,
          path: created.path,
          comment_id: created.id,
        },
      },
      transaction,
    );
    created.revision = where.revision;
    return created;
  });
}

export type ThreadStep = 'reply' | 'resolve' | 'reopen';

const STEP_ACTIONS = { reply: 'comment.replied', resolve: 'comment.resolved', reopen: 'comment.reopened' } as const;

/** A reply, a resolve or a reopen of the thread that `threadId` starts; answers the thread's first comment. */
export async function stepThread(
  sequelize: Sequelize,
  threadId: string,
  workspaceId: string,
  user: User,
  step: ThreadStep,
  body = '',
): Promise<ReviewComment> {
  return sequelize.transaction(async (transaction) => {
    const thread = await ReviewComment.findByPk(threadId, {
      lock: transaction.LOCK.UPDATE,
      include: [{ association: 'model', required: true }],
      transaction,
    });
    if (!thread) throw new Unprocessable('The comment is gone.', { code: 'comment-not-found' });
    if (thread.parentId !== null) {
      throw new Unprocessable('This is a reply; reply to, resolve or reopen the thread’s first comment instead.', {
        code: 'not-a-thread',
        details: { thread_id: thread.parentId },
      });
    }
    if (step === 'reply') {
      await ReviewComment.create(
        {
          reviewId: thread.reviewId,
          revisionId: thread.revisionId,
          modelId: thread.modelId,
          parentId: thread.id,
          path: thread.path,
          body,
          authorId: user.id,
        },
        { transaction },
      );
    } else if (step === 'resolve') {
      if (thread.resolvedAt) throw new Conflict('This thread is already resolved.', { code: 'already-resolved' });
      await thread.update({ resolvedAt: new Date(), resolvedBy: user.id }, { transaction });
    } else {
      if (!thread.resolvedAt) throw new Conflict('This thread is open already.', { code: 'already-open' });
      await thread.update({ resolvedAt: null, resolvedBy: null }, { transaction });
    }
    await recordAuditEvent(
      {
        workspaceId,
        actor: user,
        action: STEP_ACTIONS[step],
        subjectType: 'comment',
        subjectId: thread.id,
        details: { model_id: thread.modelId, model_name: thread.model?.name ?? null, path: thread.path },
      },
      transaction,
    );
    return thread;
  });
}
