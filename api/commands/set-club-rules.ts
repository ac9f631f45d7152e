import type { Sequelize, Transaction } from 'sequelize';
import { loweredErrors, type ClubRules as Rules } from '@shared/rules/club-rules';
import { Unprocessable } from '../errors';
import { ClubRules, Review, ReviewVerdict, Revision, rulesOf, type User, type Workspace } from '../models';
import { reviewStateFromVerdicts, signOffRuleFor } from '../reviews/sign-off';
import { recordAuditEvent } from '../audit/record-audit-event';

// A review's stored state is what its verdicts mean under the rules: when the rules
// change, every review of the workspace that has verdicts is read again under the new
// ones, so the hangar's "cleared for maiden" follows the rules in force now.
async function reassessReviews(workspaceId: string, rules: Rules, transaction: Transaction): Promise<void> {
  const reviews = await Review.findAll({
    where: { workspaceId },
    include: [{ model: Revision, as: 'revision', required: true, attributes: ['id', 'modelId', 'document'] }],
    transaction,
  });
  if (reviews.length === 0) return;
  const verdicts = await ReviewVerdict.findAll({
    where: { reviewId: reviews.map((review) => review.id) },
    attributes: ['reviewId', 'reviewerId', 'verdict', 'createdAt'],
    transaction,
  });
  for (const review of reviews) {
    const own = verdicts.filter((verdict) => verdict.reviewId === review.id);
    if (own.length === 0) continue;
    const next = reviewStateFromVerdicts(own, signOffRuleFor(rules.approvals, review, review.revision!.document));
    if (next.state !== review.state || next.decidedAt?.getTime() !== review.decidedAt?.getTime())
      await review.update({ state: next.state, decidedAt: next.decidedAt }, { transaction });
  }
}

/**
 * Sets a workspace's club rules. Any check may be raised and warnings or notes (severity info) lowered
 * (or switched off); an error is never lowered (422 `error-lowered`): errors mean "do
 * not fly". Every change is an audit event carrying the rules before and after.
 */
export async function setClubRules(
  sequelize: Sequelize,
  workspace: Workspace,
  actor: User,
  rules: Rules,
): Promise<ClubRules> {
  const lowered = loweredErrors(rules.severities);
  if (lowered.length > 0) {
    throw new Unprocessable(
      `An error cannot be lowered or switched off (errors mean "do not fly"): ${lowered.join(', ')}. Raise checks or lower warnings and notes only.`,
      { code: 'error-lowered', details: { rules: lowered, fields: { severities: 'An error cannot be lowered.' } } },
    );
  }
  return sequelize.transaction(async (transaction) => {
    const before = await rulesOf(workspace.id, transaction);
    const [row] = await ClubRules.upsert(
      {
        workspaceId: workspace.id,
        severities: rules.severities,
        approvals: rules.approvals,
        updatedBy: actor.id,
        updatedAt: new Date(),
      },
      { transaction, returning: true },
    );
    await recordAuditEvent(
      {
        workspaceId: workspace.id,
        actor,
        action: 'rules.changed',
        subjectType: 'workspace',
        subjectId: workspace.id,
        details: { before, after: rules },
      },
      transaction,
    );
    await reassessReviews(workspace.id, rules, transaction);
    return row;
  });
}
