import { Op, type Sequelize, type Transaction } from 'sequelize';
import { Conflict, Unprocessable } from '../errors';
import { appLink } from '../mail/context';
import type { MailService } from '../mail/mail-service';
import { reviewRequestedMail } from '../mail/messages';
import { ChecklistTick, Membership, Review, Revision, User, type SetupModel, type Workspace } from '../models';
import { carriedItems } from '../reviews/carried-ticks';
import { roleAtLeast } from '@shared/contract/roles';
import { betweenRevisions } from '../reviews/between-revisions';
import { contributorsOf } from '../reviews/contributors';
import { recordAuditEvent } from '../audit/record-audit-event';

export interface ReviewRequest {
  workspace: Workspace;
  model: SetupModel;
  revision: Revision;
  requester: User;
  reviewerIds: string[];
  note: string;
}

const reviewersRefused = (message: string, userIds: string[]) =>
  new Unprocessable(message, {
    code: 'invalid-reviewers',
    details: { fields: { reviewers: message }, user_ids: userIds },
  });

/** The members who may review, in the order asked; refuses anyone else by name. */
async function checkReviewers(input: ReviewRequest): Promise<User[]> {
  const memberships = await Membership.findAll({
    where: { workspaceId: input.workspace.id, userId: { [Op.in]: input.reviewerIds } },
    include: [{ model: User, as: 'user', required: true }],
  });
  const byUser = new Map(memberships.map((membership) => [membership.userId, membership]));
  const outsiders = input.reviewerIds.filter((id) => !byUser.has(id));
  if (outsiders.length > 0) throw reviewersRefused('Every reviewer must be a member of this workspace.', outsiders);
  const tooLow = input.reviewerIds.filter((id) => !roleAtLeast(byUser.get(id)!.role, 'reviewer'));
  if (tooLow.length > 0) {
    const names = tooLow.map((id) => byUser.get(id)!.user!.name).join(', ');
    throw reviewersRefused(
      `Reviewers need the reviewer role or higher; ${names} ${tooLow.length === 1 ? 'is a viewer' : 'are viewers'}.`,
      tooLow,
    );
  }
  const contributors = await contributorsOf(input.revision);
  const authors = input.reviewerIds.filter((id) => contributors.has(id));
  if (authors.length > 0) {
    throw new Unprocessable(
      'An author of what this review would sign off cannot review it: nobody signs off their own setup.',
      {
        code: 'reviewer-is-author',
        details: {
          fields: { reviewers: 'Choose reviewers who wrote none of the revisions since the last approved setup.' },
          user_ids: authors,
        },
      },
    );
  }
  return input.reviewerIds.map((id) => byUser.get(id)!.user!);
}

/**
 * Brings over the ticks of the model's last earlier review for the items whose parts of
 * the setup are unchanged (reviews/carried-ticks.ts); answers the items carried.
 */
async function carryTicks(review: Review, revision: Revision, transaction: Transaction): Promise<string[]> {
  const previous = await Review.findOne({
    where: { modelId: review.modelId, id: { [Op.ne]: review.id } },
    include: [
      {
        model: Revision,
        as: 'revision',
        required: true,
        where: { number: { [Op.lte]: revision.number } },
        attributes: ['id', 'number', 'document'],
      },
    ],
    order: [
      [{ model: Revision, as: 'revision' }, 'number', 'DESC'],
      ['createdAt', 'DESC'],
    ],
    transaction,
  });
  if (!previous?.revision) return [];
  const ticks = new Map(
    (await ChecklistTick.findAll({ where: { reviewId: previous.id }, transaction })).map((tick) => [tick.item, tick]),
  );
  // The caller's revision may have been loaded without its document.
  const current = await Revision.findByPk(revision.id, { attributes: ['id', 'number', 'document'], transaction });
  if (!current) return [];
  const carried = carriedItems(new Set(ticks.keys()), previous.revision, current);
  for (const { item, reason } of carried) {
    const tick = ticks.get(item)!;
    await ChecklistTick.create(
      {
        reviewId: review.id,
        item,
        tickedBy: tick.tickedBy,
        tickedAt: tick.tickedAt,
        carriedFromReviewId: previous.id,
        carriedReason: reason,
      },
      { transaction },
    );
  }
  return carried.map(({ item }) => item);
}

/**
 * A review request for one revision, mailed to each reviewer. One open request per
 * revision: asking again while one is open would split the verdicts.
 */
export async function requestReview(sequelize: Sequelize, mail: MailService, input: ReviewRequest): Promise<Review> {
  const reviewers = await checkReviewers(input);
  const between = await betweenRevisions(input.revision);
  return sequelize.transaction(async (transaction) => {
    // Serialises requests on one revision, so two at once cannot both be "the" open one.
    await sequelize.query('SELECT pg_advisory_xact_lock(hashtext($id))', {
      bind: { id: input.revision.id },
      transaction,
    });
    const open = await Review.findOne({ where: { revisionId: input.revision.id, state: 'open' }, transaction });
    if (open) {
      throw new Conflict(
        `Revision ${input.revision.number} already has an open review; add reviewers' verdicts there.`,
        { code: 'review-open', details: { review_id: open.id } },
      );
    }
    const review = await Review.create(
      {
        revisionId: input.revision.id,
        modelId: input.model.id,
        workspaceId: input.workspace.id,
        requestedBy: input.requester.id,
        reviewerIds: reviewers.map((reviewer) => reviewer.id),
        note: input.note,
      },
      { transaction },
    );
    const carried = await carryTicks(review, input.revision, transaction);
    await recordAuditEvent(
      {
        workspaceId: input.workspace.id,
        actor: input.requester,
        action: 'review.requested',
        subjectType: 'review',
        subjectId: review.id,
        details: {
          model_id: input.model.id,
          model_name: input.model.name,
          revision_id: input.revision.id,
          number: input.revision.number,
          reviewers: reviewers.map((reviewer) => ({ id: reviewer.id, name: reviewer.name })),
          carried_ticks: carried,
        },
      },
      transaction,
    );
    for (const reviewer of reviewers) {
      await mail.queue(
        reviewRequestedMail({
          to: reviewer.email,
          reviewer: reviewer.name,
          requester: input.requester.name,
          model: input.model.name,
          revision: input.revision.number,
          workspace: input.workspace.name,
          note: input.note,
          errors: input.revision.errorCount,
          warnings: input.revision.warningCount,
          between,
          url: appLink(mail, `/w/${input.workspace.id}/reviews/${review.id}`),
        }),
        transaction,
      );
    }
    return review;
  });
}
