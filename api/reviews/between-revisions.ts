import type { Transaction } from 'sequelize';
import { changeFindings, type ChangeFinding } from '@shared/diff';
import { setupSchema } from '@shared/format/schema';
import { applyClubRules, DEFAULT_CLUB_RULES } from '@shared/rules/club-rules';
import type { Revision } from '../models';
import { rulesByModel } from '../models/ClubRules';
import { baseRevisionFor } from '../queries/review-views';

/** What a review compares against, and the mistakes that show only between the two. */
export interface BetweenRevisions {
  /** The review page's default base: the last approved revision before this one, if any. */
  base: { kind: 'approved'; number: number } | null;
  /** null when there is no base, or when either side is not a valid setup. */
  findings: ChangeFinding[] | null;
}

/**
 * The review page's "Between these revisions" for a revision, for the review-request
 * mail: the change findings against the base the page opens with (the last approved
 * revision before it; with none, the page shows the whole setup as new, and so does
 * the mail say).
 */
export async function betweenRevisions(revision: Revision, transaction?: Transaction): Promise<BetweenRevisions> {
  const { base } = await baseRevisionFor(revision, 'default', transaction);
  if (!base || base.kind !== 'approved') return { base: null, findings: null };
  const before = setupSchema.safeParse(base.revision.document);
  const after = setupSchema.safeParse(revision.document);
  const rules = (await rulesByModel([revision.modelId], transaction)).get(revision.modelId) ?? DEFAULT_CLUB_RULES;
  return {
    base: { kind: 'approved', number: base.revision.number },
    findings: before.success && after.success ? applyClubRules(changeFindings(before.data, after.data), rules) : null,
  };
}
