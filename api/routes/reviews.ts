import { Router } from 'express';
import { Op } from 'sequelize';
import { giveVerdict, setTicks } from '../commands/give-verdict';
import { recordAuditEvent } from '../commands/record-audit-event';
import { requestReview } from '../commands/request-review';
import type { AppContext } from '../context';
import { Unprocessable } from '../errors';
import { mailFor } from '../mail/context';
import { authenticate, currentUser } from '../middleware/authenticate';
import { ReviewComment, Workspace } from '../models';
import { authorizeModel, authorizeRevision, authorizeWorkspace } from '../policies/model';
import { authorizeReview } from '../policies/review';
import { presentVerdict } from '../presenters/review';
import {
  commentsShownOn,
  loadReviews,
  presentCommentsOn,
  presentReviewList,
  reviewDetail,
} from '../queries/review-views';
import { anchorExists, readAnchor } from '../reviews/anchor-path';
import { parseInput } from '../validation';
import { commentSchema, requestReviewSchema, reviewListQuery, tickSchema, verdictSchema } from './review-inputs';

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
    const { workspace } = await authorizeWorkspace(req, req.params.ws, 'read');
    const { rows, count } = await loadReviews(
      { workspaceId: workspace.id, ...STATUS_WHERE[status] },
      { limit, offset },
    );
    res.json({ data: await presentReviewList(rows), pagination: { limit, offset, total: count } });
  });

  router.get('/models/:id/reviews', signedIn, async (req, res) => {
    const { limit, offset, status } = parseInput(reviewListQuery, req.query, 'The list parameters are not valid.');
    const { model } = await authorizeModel(req, req.params.id, 'read');
    const { rows, count } = await loadReviews({ modelId: model.id, ...STATUS_WHERE[status] }, { limit, offset });
    res.json({ data: await presentReviewList(rows), pagination: { limit, offset, total: count } });
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
    await sequelize.transaction((transaction) =>
      setTicks(access.review, currentUser(req), { [input.item]: input.ticked }, transaction),
    );
    const detail = await reviewDetail(access, currentUser(req));
    res.json({ data: detail.checklist });
  });

  router.post('/reviews/:id/comments', signedIn, async (req, res) => {
    const input = parseInput(commentSchema, req.body);
    const access = await authorizeReview(req, req.params.id, 'comment');
    const { review } = access;
    if (input.path !== undefined) {
      if (!readAnchor(input.path)) {
        throw new Unprocessable(
          'The path is not a semantic path Bindery can read, like receivers[id=wing].map[pin=3].',
          { code: 'invalid-path', details: { fields: { path: 'Write the path like receivers[id=wing].map[pin=3].' } } },
        );
      }
      if (!anchorExists(review.revision.document, input.path)) {
        throw new Unprocessable(`Nothing in revision ${review.revision.number} is at ${input.path}.`, {
          code: 'path-not-found',
          details: { fields: { path: 'This path does not exist in the reviewed revision.' } },
        });
      }
    }
    const user = currentUser(req);
    const comment = await sequelize.transaction(async (transaction) => {
      const created = await ReviewComment.create(
        {
          reviewId: review.id,
          revisionId: review.revision.id,
          modelId: review.modelId,
          path: input.path ?? null,
          body: input.body,
          authorId: user.id,
        },
        { transaction },
      );
      await recordAuditEvent(
        {
          workspaceId: review.workspaceId,
          actor: user,
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
    const [presented] = await presentCommentsOn(review.revision, [comment]);
    res.status(201).json({ data: presented });
  });

  router.get('/revisions/:id/comments', signedIn, async (req, res) => {
    const { revision } = await authorizeRevision(req, req.params.id, 'read', { full: true });
    const comments = await commentsShownOn(revision);
    res.json({ data: await presentCommentsOn(revision, comments) });
  });

  return router;
}
