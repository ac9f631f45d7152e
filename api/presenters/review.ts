import type { ChecklistTick, Review, ReviewComment, ReviewVerdict, Revision, SetupModel, User } from '../models';
import { coveredWords, PRE_MAIDEN_CHECKLIST } from '../reviews/checklist';
import type { ChecklistEntry, CommentThread, ReviewSummary, VerdictEntry } from '@shared/contract/review';

type Person = Pick<User, 'id' | 'name'>;
const person = (user: Person | null | undefined) => (user ? { id: user.id, name: user.name } : null);

export interface ReviewListContext {
  users: Map<string, User>;
  /** The latest revision of each model, to tell whether a review's revision is still the one that flies. */
  latest: Map<string, Revision>;
  verdictCounts: Map<string, number>;
}

/** A review as lists show it: what, whose, who reviews, where it stands. */
export function presentReviewSummary(
  review: Review & { revision: Revision; model: SetupModel },
  context: ReviewListContext,
): ReviewSummary {
  const latest = context.latest.get(review.modelId);
  return {
    id: review.id,
    workspace_id: review.workspaceId,
    model: { id: review.model.id, name: review.model.name },
    revision: {
      id: review.revision.id,
      number: review.revision.number,
      content_hash: review.revision.contentHash,
      error_count: review.revision.errorCount,
      warning_count: review.revision.warningCount,
      author: person(context.users.get(review.revision.authorId)),
    },
    requested_by: person(context.users.get(review.requestedBy)),
    reviewers: review.reviewerIds.map((id) => person(context.users.get(id)) ?? { id, name: 'Former member' }),
    note: review.note,
    state: review.state,
    decided_at: review.decidedAt?.toISOString() ?? null,
    created_at: review.createdAt.toISOString(),
    verdict_count: context.verdictCounts.get(review.id) ?? 0,
    /** The model's latest revision, and whether it still has the reviewed content. */
    latest: latest
      ? { id: latest.id, number: latest.number, same_content: latest.contentHash === review.revision.contentHash }
      : null,
  };
}

export function presentVerdict(verdict: ReviewVerdict, users: Map<string, Person>): VerdictEntry {
  return {
    id: verdict.id,
    reviewer: person(users.get(verdict.reviewerId)),
    verdict: verdict.verdict,
    body: verdict.body,
    content_hash: verdict.contentHash,
    left_open: verdict.leftOpen ?? null,
    created_at: verdict.createdAt.toISOString(),
  };
}

/** A thread: its first comment, the replies in order, and whether it is resolved. */
export function presentThread(
  thread: ReviewComment,
  replies: readonly ReviewComment[],
  users: Map<string, Person>,
  revisions: Map<string, Pick<Revision, 'id' | 'number'>>,
  shownOn: string,
): CommentThread {
  const revision = revisions.get(thread.revisionId);
  return {
    id: thread.id,
    review_id: thread.reviewId,
    path: thread.path,
    body: thread.body,
    author: person(users.get(thread.authorId)),
    revision: revision ? { id: revision.id, number: revision.number } : { id: thread.revisionId, number: null },
    carried: thread.revisionId !== shownOn,
    created_at: thread.createdAt.toISOString(),
    replies: replies.map((reply) => ({
      id: reply.id,
      body: reply.body,
      author: person(users.get(reply.authorId)),
      created_at: reply.createdAt.toISOString(),
    })),
    resolved:
      thread.resolvedAt && thread.resolvedBy
        ? { by: person(users.get(thread.resolvedBy)), at: thread.resolvedAt.toISOString() }
        : null,
  };
}

export function presentChecklist(
  ticks: readonly ChecklistTick[],
  users: Map<string, Person>,
  reviewNumbers: Map<string, number>,
): ChecklistEntry[] {
  const byItem = new Map(ticks.map((tick) => [tick.item, tick]));
  return PRE_MAIDEN_CHECKLIST.map(({ covers, ...item }) => {
    const tick = byItem.get(item.id);
    return {
      ...item,
      covers: covers ? coveredWords(covers) : null,
      ticked: Boolean(tick),
      ticked_by: tick ? person(users.get(tick.tickedBy)) : null,
      ticked_at: tick?.tickedAt.toISOString() ?? null,
      carried:
        tick?.carriedFromReviewId && tick.carriedReason
          ? {
              review_id: tick.carriedFromReviewId,
              revision_number: reviewNumbers.get(tick.carriedFromReviewId) ?? null,
              reason: tick.carriedReason,
            }
          : null,
    };
  });
}
