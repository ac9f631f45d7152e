import { Op, QueryTypes, type Transaction } from 'sequelize';
import { compareRevisions } from '@shared/diff';
import { ChecklistTick, Review, ReviewComment, ReviewVerdict, Revision, SetupModel, User } from '../models';
import type { GrantedReview } from '../access/records';
import { approvalRefusal } from '../reviews/approval-refusal';
import { reviewPolicy } from '../policies/review';
import {
  presentChecklist,
  presentComment,
  presentReviewSummary,
  presentVerdict,
  type ReviewListContext,
} from '../presenters/review';
import { presentRevisionSummary } from '../presenters/revision';
import { anchorExists } from '../reviews/anchor-path';
import { clearedForMaiden, reviewStateOf } from '../review-state';
import { latestRevisions } from './model-views';

const SUMMARY = { exclude: ['yamlText', 'document', 'findings'] };

export async function usersById(ids: Iterable<string>): Promise<Map<string, User>> {
  const unique = [...new Set(ids)];
  if (unique.length === 0) return new Map();
  const users = await User.findAll({ where: { id: unique }, attributes: ['id', 'name', 'email'] });
  return new Map(users.map((user) => [user.id, user]));
}

export type LoadedReview = Review & { revision: Revision; model: SetupModel };

/** Reviews with their revision (without text) and model, for lists. */
export function loadReviews(where: Record<string, unknown>, options: { limit: number; offset: number }) {
  return Review.findAndCountAll({
    where,
    include: [
      { model: Revision, as: 'revision', required: true, attributes: SUMMARY },
      { model: SetupModel, as: 'model', required: true },
    ],
    order: [
      ['createdAt', 'DESC'],
      ['id', 'DESC'],
    ],
    limit: options.limit,
    offset: options.offset,
  }) as Promise<{ rows: LoadedReview[]; count: number }>;
}

export async function reviewListContext(reviews: readonly LoadedReview[]): Promise<ReviewListContext> {
  const [users, latest, counts] = await Promise.all([
    usersById(reviews.flatMap((review) => [review.requestedBy, review.revision.authorId, ...review.reviewerIds])),
    latestRevisions([...new Set(reviews.map((review) => review.modelId))]),
    reviews.length === 0
      ? []
      : Review.sequelize!.query<{ review_id: string; count: string }>(
          'SELECT review_id, count(*) AS count FROM review_verdicts WHERE review_id = ANY($ids::uuid[]) GROUP BY review_id',
          {
            bind: { ids: reviews.map((review) => review.id) },
            type: QueryTypes.SELECT,
          },
        ),
  ]);
  return { users, latest, verdictCounts: new Map(counts.map((row) => [row.review_id, Number(row.count)])) };
}

export async function presentReviewList(reviews: readonly LoadedReview[]) {
  const context = await reviewListContext(reviews);
  return reviews.map((review) => presentReviewSummary(review, context));
}

/**
 * What a review compares against: the model's last approved revision before this one,
 * else its parent, else (for a fork's first revision) the revision it was forked from.
 */
export async function baseRevisionFor(
  revision: Revision,
  /** For a caller inside a transaction that wrote the revisions (the demo seed). */
  transaction?: Transaction,
): Promise<{ kind: 'approved' | 'parent' | 'fork-source'; revision: Revision } | null> {
  const [row] = await Revision.sequelize!.query<{ id: string }>(
    `SELECT rv.id FROM revisions rv
      WHERE rv.model_id = $model AND rv.number < $number
        AND EXISTS (SELECT 1 FROM reviews r WHERE r.revision_id = rv.id AND r.state = 'approved')
      ORDER BY rv.number DESC LIMIT 1`,
    { bind: { model: revision.modelId, number: revision.number }, type: QueryTypes.SELECT, transaction },
  );
  const approved = row ? await Revision.findByPk(row.id, { transaction }) : null;
  if (approved) return { kind: 'approved', revision: approved };
  if (revision.parentId) {
    const parent = await Revision.findByPk(revision.parentId, { transaction });
    if (parent) return { kind: 'parent', revision: parent };
  }
  if (revision.origin === 'fork' && revision.sourceRevisionId) {
    const source = await Revision.findByPk(revision.sourceRevisionId, { transaction });
    if (source) return { kind: 'fork-source', revision: source };
  }
  return null;
}

/**
 * The comments to show on a revision: its own, and the anchored comments made on the
 * model's earlier revisions whose path still exists in this revision's document.
 */
export async function commentsShownOn(revision: Revision): Promise<ReviewComment[]> {
  const candidates = await ReviewComment.findAll({
    where: { modelId: revision.modelId },
    include: [
      {
        model: Revision,
        as: 'revision',
        required: true,
        attributes: ['id', 'number'],
        where: { number: { [Op.lte]: revision.number } },
      },
    ],
    order: [
      ['createdAt', 'ASC'],
      ['id', 'ASC'],
    ],
  });
  return candidates.filter(
    (comment) =>
      comment.revisionId === revision.id || (comment.path !== null && anchorExists(revision.document, comment.path)),
  );
}

export async function presentCommentsOn(revision: Revision, comments: readonly ReviewComment[]) {
  const users = await usersById(comments.map((comment) => comment.authorId));
  const revisions = new Map(
    comments.flatMap((comment) => (comment.revision ? [[comment.revisionId, comment.revision] as const] : [])),
  );
  return comments.map((comment) => presentComment(comment, users, revisions, revision.id));
}

/** Everything the review page shows. */
export async function reviewDetail(access: GrantedReview, caller: User) {
  const { review } = access;
  const revision = review.revision;
  const [context, base, verdicts, ticks, comments] = await Promise.all([
    reviewListContext([review]),
    baseRevisionFor(revision),
    ReviewVerdict.findAll({
      where: { reviewId: review.id },
      order: [
        ['createdAt', 'ASC'],
        ['id', 'ASC'],
      ],
    }),
    ChecklistTick.findAll({ where: { reviewId: review.id } }),
    commentsShownOn(revision),
  ]);
  const users = await usersById([
    ...verdicts.map((verdict) => verdict.reviewerId),
    ...ticks.map((tick) => tick.tickedBy),
    ...(base ? [base.revision.authorId] : []),
  ]);
  for (const [id, user] of context.users) users.set(id, user);
  const latest = context.latest.get(review.modelId);
  const modelState = latest ? ((await reviewStateOf([latest])).get(latest.id) ?? 'none') : 'none';
  const canVerdict = reviewPolicy(access.role, 'verdict').allowed;
  const refusal = canVerdict ? await approvalRefusal(access, caller) : null;
  const summarise = (entry: Revision) => {
    entry.author = users.get(entry.authorId);
    return presentRevisionSummary(entry, []);
  };

  return {
    ...presentReviewSummary(review, context),
    revision: summarise(revision),
    findings: revision.findings,
    base: base ? { kind: base.kind, revision: summarise(base.revision) } : null,
    compare: base
      ? compareRevisions(
          { text: base.revision.yamlText, data: base.revision.document, findings: base.revision.findings },
          { text: revision.yamlText, data: revision.document, findings: revision.findings },
        )
      : null,
    checklist: presentChecklist(ticks, users),
    verdicts: verdicts.map((verdict) => presentVerdict(verdict, users)),
    comments: await presentCommentsOn(revision, comments),
    model_state: { review_state: modelState, cleared_for_maiden: clearedForMaiden(modelState) },
    can: {
      verdict: canVerdict,
      approve: canVerdict && refusal === null,
      approve_refusal: refusal ? { code: refusal.code, message: refusal.message } : null,
      tick: reviewPolicy(access.role, 'tick').allowed,
      comment: reviewPolicy(access.role, 'comment').allowed,
    },
  };
}
