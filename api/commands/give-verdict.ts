import type { Sequelize, Transaction } from 'sequelize';
import { Unprocessable } from '../errors';
import { appLink } from '../mail/context';
import type { MailService } from '../mail/mail-service';
import { verdictMail } from '../mail/messages';
import { ChecklistTick, Review, ReviewVerdict, rulesOf, User, type Revision } from '../models';
import type { LeftOpen } from '@shared/contract/review';
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
  /** The approver has seen what is left (unticked items, open warnings) and approves all the same. */
  confirmLeftOpen: boolean;
}

/** What an approval of this revision would leave undone, with the review's ticks as they now stand. */
export async function leftOpenOf(review: Review, revision: Revision, transaction: Transaction): Promise<LeftOpen> {
  const ticked = new Set(
    (await ChecklistTick.findAll({ where: { reviewId: review.id }, attributes: ['item'], transaction })).map(
      (tick) => tick.item,
    ),
  );
  return {
    unticked: PRE_MAIDEN_CHECKLIST.filter((item) => !ticked.has(item.id)).map(({ id, label }) => ({ id, label })),
    // An accepted warning carries the pilot's reason and is not open (docs/format.md, accepted).
    warnings: revision.findings
      .filter((finding) => finding.severity === 'warning' && finding.accepted === undefined)
      .map(({ rule, path, message }) => ({ rule, path, message })),
  };
}

const nothingLeft = (left: LeftOpen) => left.unticked.length === 0 && left.warnings.length === 0;

function confirmationNeeded(left: LeftOpen): Unprocessable {
  const parts = [
    left.unticked.length > 0 &&
      `${left.unticked.length} checklist item${left.unticked.length === 1 ? ' is' : 's are'} not ticked`,
    left.warnings.length > 0 && `${left.warnings.length} warning${left.warnings.length === 1 ? ' is' : 's are'} open`,
  ].filter(Boolean);
  return new Unprocessable(
    `${parts.join(' and ')}: confirm that you approve with these left (send confirm_left_open: true), or finish them first.`,
    { code: 'confirmation-needed', details: { left_open: left } },
  );
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
    await setTicks(review, user, input.checklist, transaction);
    let leftOpen: LeftOpen | null = null;
    if (input.verdict === 'approve') {
      const left = await leftOpenOf(review, revision, transaction);
      if (!nothingLeft(left)) {
        // Refused inside the transaction, so the ticks sent along are not kept either.
        if (!input.confirmLeftOpen) throw confirmationNeeded(left);
        leftOpen = left;
      }
    }
    const verdict = await ReviewVerdict.create(
      {
        reviewId: review.id,
        reviewerId: user.id,
        verdict: input.verdict,
        body: input.body,
        contentHash: revision.contentHash,
        leftOpen,
      },
      { transaction },
    );
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
          left_open: leftOpen,
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
