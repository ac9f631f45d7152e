import type { Sequelize } from 'sequelize';
import { Unprocessable } from '../errors';
import { appLink } from '../mail/context';
import type { MailService } from '../mail/mail-service';
import { verdictMail } from '../mail/messages';
import { ChecklistTick, Review, ReviewVerdict, rulesOf, User } from '../models';
import type { Verdict } from '../models/ReviewVerdict';
import { PRE_MAIDEN_CHECKLIST } from '../reviews/checklist';
import { approvalRefusal } from '../reviews/approval-refusal';
import { reviewStateFromVerdicts, signOffRuleFor } from '../reviews/sign-off';
import type { GrantedReview } from '../access/records';
import { recordAuditEvent } from '../audit/record-audit-event';
import { setTicks } from './tick-checklist';

export interface VerdictInput {
  verdict: Verdict;
  body: string;
  /** Checklist items to tick (true) or untick (false) along with the verdict. */
  checklist: Record<string, boolean>;
}

/**
 * Records a verdict pinned to the revision's content hash, applies its checklist
 * ticks, moves the review's state, and mails the requester and the author.
 */
export async function giveVerdict(
  sequelize: Sequelize,
  mail: MailService,
  access: GrantedReview,
  user: User,
  input: VerdictInput,
): Promise<{ verdict: ReviewVerdict; review: Review }> {
  if (input.verdict === 'approve') {
    const refusal = await approvalRefusal(access, user);
    if (refusal) throw refusal;
  }
  const { revision, model } = access.review;
  return sequelize.transaction(async (transaction) => {
    const review = await Review.findByPk(access.review.id, { lock: transaction.LOCK.UPDATE, transaction });
    if (!review) throw new Unprocessable('The review is gone.', { code: 'review-not-found' });
    const verdict = await ReviewVerdict.create(
      {
        reviewId: review.id,
        reviewerId: user.id,
        verdict: input.verdict,
        body: input.body,
        contentHash: revision.contentHash,
      },
      { transaction },
    );
    await setTicks(review, user, input.checklist, transaction);
    const all = await ReviewVerdict.findAll({
      where: { reviewId: review.id },
      attributes: ['reviewerId', 'verdict', 'createdAt'],
      transaction,
    });
    const rules = await rulesOf(review.workspaceId, transaction);
    const next = reviewStateFromVerdicts(all, signOffRuleFor(rules.approvals, review, revision.document));
    await review.update({ state: next.state, decidedAt: next.decidedAt }, { transaction });
    await recordAuditEvent(
      {
        workspaceId: review.workspaceId,
        actor: user,
        action: 'review.verdict',
        subjectType: 'review',
        subjectId: review.id,
        details: {
          verdict: input.verdict,
          model_id: model.id,
          model_name: model.name,
          revision_id: revision.id,
          number: revision.number,
          content_hash: revision.contentHash,
        },
      },
      transaction,
    );
    const ticked = await ChecklistTick.count({ where: { reviewId: review.id }, transaction });
    const recipientIds = [...new Set([review.requestedBy, revision.authorId])].filter((id) => id !== user.id);
    const recipients = await User.findAll({ where: { id: recipientIds }, transaction });
    for (const recipient of recipients) {
      await mail.queue(
        verdictMail({
          to: recipient.email,
          recipient: recipient.name,
          reviewer: user.name,
          verdict: input.verdict,
          body: input.body,
          model: model.name,
          revision: revision.number,
          workspace: access.workspace.name,
          ticked,
          items: PRE_MAIDEN_CHECKLIST.length,
          url: appLink(mail, `/w/${review.workspaceId}/reviews/${review.id}`),
        }),
        transaction,
      );
    }
    return { verdict, review };
  });
}
