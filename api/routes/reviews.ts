import { Router } from 'express';
import { Op } from 'sequelize';
import { commentOnReview } from '../commands/comment-on-review';
import { giveVerdict } from '../commands/give-verdict';
import { requestReview } from '../commands/request-review';
import { tickChecklist } from '../commands/tick-checklist';
import type { AppContext } from '../context';
import { mailFor } from '../mail/context';
import { authenticate, currentUser } from '../middleware/authenticate';
import { Workspace } from '../models';
import { reviewPolicy } from '../policies/review';
import { authorizeModel, authorizeReview, authorizeRevision, authorizeWorkspace } from './authorize';
import { presentVerdict } from '../presenters/review';
import {
  commentsShownOn,
  loadReviews,
  presentCommentsOn,
  presentReviewList,
  reviewDetail,
} from '../queries/review-views';
import { parseInput } from '../validation';
import { pageInput, pagination } from './paging';
import { commentSchema, requestReviewSchema, reviewListQuery, tickSchema, verdictSchema } from './review-inputs';

const commentsQuery = pageInput(100);

const STATUS_WHERE = { open: { state: 'open' }, closed: { state: { [Op.ne]: 'open' } }, all: {} } as const;

/** Review requests, verdicts, the pre-maiden checklist and anchored comments. */
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
    const access = await authorizeReview(req, req.params.id, 'read');
    res.json({ data: await reviewDetail(access, currentUser(req)) });
  });

  router.post('/reviews/:id/verdicts', signedIn, async (req, res) => {
    const input = parseInput(verdictSchema, req.body);
    const access = await authorizeReview(req, req.params.id, 'verdict');
    const user = currentUser(req);
    const { verdict, review } = await giveVerdict(sequelize, mailFor(context), access, user, {
      verdict: input.verdict,
      body: input.body ?? '',
      checklist: input.checklist ?? {},
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
    const access = await authorizeReview(req, req.params.id, 'comment');
    const { review } = access;
    const comment = await commentOnReview(sequelize, { review, author: currentUser(req), ...input });
    const [presented] = await presentCommentsOn(review.revision, [comment]);
    res.status(201).json({ data: presented });
  });

  router.get('/revisions/:id/comments', signedIn, async (req, res) => {
    const page = parseInput(commentsQuery, req.query, 'The paging parameters are not valid.');
    const { revision } = await authorizeRevision(req, req.params.id, 'read', { full: true });
    // Which comments a revision shows depends on its document (anchored ones carry
    // forward while their path exists), so the page is cut after that choice.
    const comments = await commentsShownOn(revision);
    const shown = comments.slice(page.offset, page.offset + page.limit);
    res.json({ data: await presentCommentsOn(revision, shown), pagination: pagination(page, comments.length) });
  });

  return router;
}
