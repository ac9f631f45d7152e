import { Op, QueryTypes, type Transaction } from 'sequelize';
import { compareRevisions, type Comparison } from '@shared/diff';
import { applyClubRules, type ClubRules } from '@shared/rules/club-rules';
import { reviewPlan } from '@shared/diff/review-plan';
import type { CommentStatus, ReviewDetail, ThreadCounts } from '@shared/contract/review';
import { Unprocessable } from '../errors';
import { ChecklistTick, Review, ReviewComment, ReviewVerdict, Revision, SetupModel, User } from '../models';
import type { GrantedReview } from '../access/records';
import { approvalRefusal } from '../reviews/approval-refusal';
import { reviewPolicy } from '../policies/review';
import {
  presentChecklist,
  presentThread,
  presentReviewSummary,
  presentVerdict,
  type ReviewListContext,
} from '../presenters/review';
import { presentRevisionSummary } from '../presenters/revision';
import { anchorExists } from '../reviews/anchor-path';
import { clearedForMaiden, reviewStateOf } from '../review-state';
import { latestRevisions } from './model-views';
import { rulesOf } from '../models/ClubRules';

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

/** The reviewed revision's base as the caller asked for it: a kind by name, or a revision by number or id. */
export type BaseChoice = 'default' | 'approved' | 'previous' | 'none' | { number: number } | { id: string };

/** The model's last approved revision before this one, if there is one. */
async function lastApprovedBefore(revision: Revision, transaction?: Transaction): Promise<Revision | null> {
  const [row] = await Revision.sequelize!.query<{ id: string }>(
    `SELECT rv.id FROM revisions rv
      WHERE rv.model_id = $model AND rv.number < $number
        AND EXISTS (SELECT 1 FROM reviews r WHERE r.revision_id = rv.id AND r.state = 'approved')
      ORDER BY rv.number DESC LIMIT 1`,
    { bind: { model: revision.modelId, number: revision.number }, type: QueryTypes.SELECT, transaction },
  );
  return row ? Revision.findByPk(row.id, { transaction }) : null;
}

const previousOf = (revision: Revision, transaction?: Transaction) =>
  revision.number > 1
    ? Revision.findOne({ where: { modelId: revision.modelId, number: revision.number - 1 }, transaction })
    : null;

const baseRefused = (message: string, code: string) =>
  new Unprocessable(message, { code, details: { fields: { base: message } } });

/**
 * What a review compares against. By default the model's last approved revision before
 * this one, else nothing: a first review shows the whole setup as new rather than the
 * last small edit. The reviewer may choose the previous revision or any other.
 */
export async function baseRevisionFor(
  revision: Revision,
  choice: BaseChoice,
  /** For a caller inside a transaction that wrote the revisions (the demo seed). */
  transaction?: Transaction,
): Promise<{
  base: { kind: 'approved' | 'previous' | 'chosen'; revision: Revision } | null;
  options: { approved: Revision | null; previous: Revision | null };
}> {
  const [approved, previous] = await Promise.all([
    lastApprovedBefore(revision, transaction),
    previousOf(revision, transaction),
  ]);
  const options = { approved, previous };
  if (choice === 'none') return { base: null, options };
  if (choice === 'default') return { base: approved ? { kind: 'approved', revision: approved } : null, options };
  if (choice === 'approved') {
    if (!approved)
      throw baseRefused(
        `No revision before revision ${revision.number} is approved; compare with the previous one or choose one.`,
        'no-approved-base',
      );
    return { base: { kind: 'approved', revision: approved }, options };
  }
  if (choice === 'previous') {
    if (!previous) throw baseRefused('Revision 1 has no revision before it.', 'no-previous-base');
    return { base: { kind: 'previous', revision: previous }, options };
  }
  const chosen = await Revision.findOne({
    where: { modelId: revision.modelId, ...('number' in choice ? { number: choice.number } : { id: choice.id }) },
    transaction,
  });
  if (!chosen)
    throw baseRefused(
      `${'number' in choice ? `Revision ${choice.number}` : 'That revision'} is not one of this model’s revisions.`,
      'base-not-found',
    );
  if (chosen.id === revision.id)
    throw baseRefused('Compare the reviewed revision with another one, not with itself.', 'base-is-reviewed');
  return { base: { kind: 'chosen', revision: chosen }, options };
}

/**
 * The threads to show on a revision: its own, and those started on the model's earlier
 * revisions whose setting still exists in this revision's document; oldest first.
 */
export async function threadsShownOn(revision: Revision, status: CommentStatus = 'all'): Promise<ReviewComment[]> {
  const candidates = await ReviewComment.findAll({
    where: {
      modelId: revision.modelId,
      parentId: null,
      ...(status === 'open' ? { resolvedAt: null } : status === 'resolved' ? { resolvedAt: { [Op.ne]: null } } : {}),
    },
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

/** The thread a comment belongs to (its first comment), with the revision it was written on. */
export async function threadOf(comment: Pick<ReviewComment, 'id' | 'parentId'>): Promise<ReviewComment> {
  return ReviewComment.findOne({
    where: { id: comment.parentId ?? comment.id },
    include: [{ model: Revision, as: 'revision', attributes: ['id', 'number'] }],
    rejectOnEmpty: true,
  });
}

/** The threads with their replies and the people named, shown on `revision`. */
export async function presentThreadsOn(revision: Pick<Revision, 'id'>, threads: readonly ReviewComment[]) {
  const replies =
    threads.length === 0
      ? []
      : await ReviewComment.findAll({
          where: { parentId: threads.map((thread) => thread.id) },
          order: [
            ['createdAt', 'ASC'],
            ['id', 'ASC'],
          ],
        });
  const byThread = new Map<string, ReviewComment[]>();
  for (const reply of replies) byThread.set(reply.parentId!, [...(byThread.get(reply.parentId!) ?? []), reply]);
  const users = await usersById([
    ...threads.flatMap((thread) => [thread.authorId, ...(thread.resolvedBy ? [thread.resolvedBy] : [])]),
    ...replies.map((reply) => reply.authorId),
  ]);
  const revisions = new Map(
    threads.flatMap((thread) => (thread.revision ? [[thread.revisionId, thread.revision] as const] : [])),
  );
  return threads.map((thread) => presentThread(thread, byThread.get(thread.id) ?? [], users, revisions, revision.id));
}

/** The counts the review page needs before it reads the threads page by page. */
function threadCounts(threads: readonly ReviewComment[]): ThreadCounts {
  const open = threads.filter((thread) => thread.resolvedAt === null);
  return {
    open: open.length,
    resolved: threads.length - open.length,
    open_paths: open.flatMap((thread) => (thread.path === null ? [] : [thread.path])),
  };
}

/** The numbers of the revisions the given reviews were of, keyed by review id. */
async function reviewedNumbers(reviewIds: readonly string[]): Promise<Map<string, number>> {
  if (reviewIds.length === 0) return new Map();
  const reviews = await Review.findAll({
    where: { id: [...new Set(reviewIds)] },
    attributes: ['id'],
    include: [{ model: Revision, as: 'revision', attributes: ['number'] }],
  });
  return new Map(reviews.flatMap((review) => (review.revision ? [[review.id, review.revision.number] as const] : [])));
}

/** The review's compare, its change findings ranked by the club's rules like every other finding. */
function ruledComparison(base: Revision, revision: Revision, rules: Pick<ClubRules, 'severities'>): Comparison {
  const comparison = compareRevisions(
    { text: base.yamlText, data: base.document, findings: base.findings },
    { text: revision.yamlText, data: revision.document, findings: revision.findings },
  );
  return {
    ...comparison,
    change_findings: comparison.change_findings && applyClubRules(comparison.change_findings, rules),
  };
}

/** Everything the review page shows, compared with the base the caller chose. */
export async function reviewDetail(
  access: GrantedReview,
  caller: User,
  choice: BaseChoice = 'default',
): Promise<ReviewDetail> {
  const { review } = access;
  const revision = review.revision;
  const [context, { base, options }, verdicts, ticks, threads] = await Promise.all([
    reviewListContext([review]),
    baseRevisionFor(revision, choice),
    ReviewVerdict.findAll({
      where: { reviewId: review.id },
      order: [
        ['createdAt', 'ASC'],
        ['id', 'ASC'],
      ],
    }),
    ChecklistTick.findAll({ where: { reviewId: review.id } }),
    threadsShownOn(revision),
  ]);
  const [users, carriedNumbers] = await Promise.all([
    usersById([
      ...verdicts.map((verdict) => verdict.reviewerId),
      ...ticks.map((tick) => tick.tickedBy),
      ...(base ? [base.revision.authorId] : []),
    ]),
    reviewedNumbers(ticks.flatMap((tick) => (tick.carriedFromReviewId ? [tick.carriedFromReviewId] : []))),
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
  const pointer = (entry: Revision | null) => (entry ? { id: entry.id, number: entry.number } : null);

  return {
    ...presentReviewSummary(review, context),
    revision: summarise(revision),
    findings: revision.findings,
    base: base ? { kind: base.kind, revision: summarise(base.revision) } : null,
    base_options: { approved: pointer(options.approved), previous: pointer(options.previous) },
    compare: base ? ruledComparison(base.revision, revision, await rulesOf(review.workspaceId)) : null,
    plan: reviewPlan(revision.document, base ? base.revision.document : null),
    checklist: presentChecklist(ticks, users, carriedNumbers),
    verdicts: verdicts.map((verdict) => presentVerdict(verdict, users)),
    threads: threadCounts(threads),
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
