import { Router, type Request, type Response } from 'express';
import { Op } from 'sequelize';
import { giveVerdict } from '../commands/give-verdict';
import { startThread, stepThread, type ThreadStep } from '../commands/comment-threads';
import { requestReview } from '../commands/request-review';
import { tickChecklist } from '../commands/tick-checklist';
import type { AppContext } from '../context';
import { mailFor } from '../mail/context';
import { authenticate, currentUser } from '../middleware/authenticate';
import { Workspace } from '../models';
import { reviewPolicy } from '../policies/review';
import { authorizeComment, authorizeModel, authorizeReview, authorizeRevision, authorizeWorkspace } from './authorize';
import { presentVerdict } from '../presenters/review';
import {
  loadReviews,
  presentReviewList,
  presentThreadsOn,
  reviewDetail,
  threadOf,
  threadsShownOn,
} from '../queries/review-views';
import { parseInput } from '../validation';
import { pagination } from './paging';
import {
  commentListQuery,
  commentSchema,
  emptyBody,
  replySchema,
  requestReviewSchema,
  reviewDetailQuery,
  reviewListQuery,
  tickSchema,
  verdictSchema,
} from './review-inputs';

const STATUS_WHERE = { open: { state: 'open' }, closed: { state: { [Op.ne]: 'open' } }, all: {} } as const;

/** Review requests, verdicts, the pre-maiden checklist and comment threads. */
export function reviewsRouter(context: AppContext): Router {
  const { sequelize, config } = context;
  const router = Router();
  const signedIn = authenticate(config);

  router.post('/revisions/:id/reviews', signedIn, async (req, res) => {
    const input = parseInput(requestReviewSchema, req.body);
    // The document, for the mail's "Between these revisions".
    const { revision, model } = await authorizeRevision(req, req.params.id, 'edit', { fields: ['document'] });
    const workspace = await Workspace.findByPk(model.workspaceId, { rejectOnEmpty: true });
    const review = await requestReview(sequelize, mailFor(context), {
      workspace,
      model,
      revision,
      requester: currentUser(req),
      reviewerIds: input.reviewers,
      note: input.note ?? '',
    });
    const [presented] = await presentReviewList([Object.assign(review, { revision, model })]);
    res.status(201).json({ data: presented });
  });

  router.get('/workspaces/:ws/reviews', signedIn, async (req, res) => {
    const { limit, offset, status } = parseInput(reviewListQuery, req.query, 'The list parameters are not valid.');
    const { workspace } = await authorizeWorkspace(req, req.params.ws, reviewPolicy, 'read');
    const { rows, count } = await loadReviews(
      { workspaceId: workspace.id, ...STATUS_WHERE[status] },
      { limit, offset },
    );
    res.json({ data: await presentReviewList(rows), pagination: pagination({ limit, offset }, count) });
  });

  router.get('/models/:id/reviews', signedIn, async (req, res) => {
    const { limit, offset, status } = parseInput(reviewListQuery, req.query, 'The list parameters are not valid.');
    const { model } = await authorizeModel(req, req.params.id, 'read');
    const { rows, count } = await loadReviews({ modelId: model.id, ...STATUS_WHERE[status] }, { limit, offset });
    res.json({ data: await presentReviewList(rows), pagination: pagination({ limit, offset }, count) });
  });

  router.get('/reviews/:id', signedIn, async (req, res) => {
    const { base } = parseInput(reviewDetailQuery, req.query, 'The comparison base is not valid.');
    const access = await authorizeReview(req, req.params.id, 'read');
    res.json({ data: await reviewDetail(access, currentUser(req), base) });
  });

  router.post('/reviews/:id/verdicts', signedIn, async (req, res) => {
    const input = parseInput(verdictSchema, req.body);
    const access = await authorizeReview(req, req.params.id, 'verdict');
    const user = currentUser(req);
    const { verdict, review } = await giveVerdict(sequelize, mailFor(context), access, user, {
      verdict: input.verdict,
      body: input.body ?? '',
      checklist: input.checklist ?? {},
      confirmLeftOpen: input.confirm_left_open ?? false,
    });
    res.status(201).json({
      data: {
        ...presentVerdict(verdict, new Map([[user.id, user]])),
        review: { id: review.id, state: review.state, decided_at: review.decidedAt?.toISOString() ?? null },
      },
    });
  });

  router.post('/reviews/:id/checklist', signedIn, async (req, res) => {
    const input = parseInput(tickSchema, req.body);
    const access = await authorizeReview(req, req.params.id, 'tick');
    await tickChecklist(sequelize, {
      review: access.review,
      user: currentUser(req),
      changes: { [input.item]: input.ticked },
    });
    const detail = await reviewDetail(access, currentUser(req));
    res.json({ data: detail.checklist });
  });

  router.post('/reviews/:id/comments', signedIn, async (req, res) => {
    const input = parseInput(commentSchema, req.body);
    const { review } = await authorizeReview(req, req.params.id, 'comment');
    const thread = await startThread(
      sequelize,
      { workspaceId: review.workspaceId, model: review.model, revision: review.revision, reviewId: review.id },
      currentUser(req),
      { path: input.path ?? null, body: input.body },
    );
    const [presented] = await presentThreadsOn(review.revision, [thread]);
    res.status(201).json({ data: presented });
  });

  // A thread on a revision outside any review, started from the Overview.
  router.post('/revisions/:id/comments', signedIn, async (req, res) => {
    const input = parseInput(commentSchema, req.body);
    const { revision, model } = await authorizeRevision(req, req.params.id, 'comment', { full: true });
    const thread = await startThread(
      sequelize,
      { workspaceId: model.workspaceId, model, revision, reviewId: null },
      currentUser(req),
      { path: input.path ?? null, body: input.body },
    );
    const [presented] = await presentThreadsOn(revision, [thread]);
    res.status(201).json({ data: presented });
  });

  router.get('/revisions/:id/comments', signedIn, async (req, res) => {
    const page = parseInput(commentListQuery, req.query, 'The list parameters are not valid.');
    const { revision } = await authorizeRevision(req, req.params.id, 'read', { full: true });
    // Which threads a revision shows depends on its document (anchored ones carry
    // forward while their path exists), so the page is cut after that choice.
    const threads = await threadsShownOn(revision, page.status);
    const shown = threads.slice(page.offset, page.offset + page.limit);
    res.json({ data: await presentThreadsOn(revision, shown), pagination: pagination(page, threads.length) });
  });

  const threadStep = (step: ThreadStep) => async (req: Request, res: Response) => {
    const input = step === 'reply' ? parseInput(replySchema, req.body) : parseInput(emptyBody, req.body ?? {});
    const { comment, workspace } = await authorizeComment(req, req.params.id, 'comment');
    await stepThread(sequelize, comment.id, workspace.id, currentUser(req), step, 'body' in input ? input.body : '');
    const thread = await threadOf(comment);
    const [presented] = await presentThreadsOn(comment.revision, [thread]);
    res.status(step === 'reply' ? 201 : 200).json({ data: presented });
  };
  router.post('/comments/:id/replies', signedIn, threadStep('reply'));
  router.post('/comments/:id/resolve', signedIn, threadStep('resolve'));
  router.post('/comments/:id/reopen', signedIn, threadStep('reopen'));

  return router;
}
