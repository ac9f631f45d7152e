import { approvalsNeeded, signOffFacts, type ApprovalRules } from '@shared/rules/club-rules';
import type { ReviewRequestState } from '../models/Review';
import type { Verdict } from '../models/ReviewVerdict';
import type { ReviewState } from '../review-state';

// The rules of sign-off, as pure functions over the recorded verdicts (docs/design.md,
// capability 8): an approval is pinned to a content hash, so it holds for any later
// revision with the same hash (a change of comments or formatting only) and goes
// stale when the content changes.

export interface VerdictFact {
  reviewerId: string;
  verdict: Verdict;
  createdAt: Date;
}

/** What the club's rules ask of a sign-off (docs/design.md, club rules). */
export interface SignOffRule {
  /** Approvals needed, 1 to 3. */
  needed: number;
  /** When set, only approvals by these reviewers count. */
  approvers: readonly string[] | null;
}

export const ONE_APPROVAL: SignOffRule = { needed: 1, approvers: null };

/**
 * A review's own state: each reviewer's latest approve or request-changes counts
 * (comments do not); one outstanding request for changes outweighs approvals, and as
 * many approvals as the club's rule asks (one by default) without such a request are
 * a sign-off.
 */
export function reviewStateFromVerdicts(
  verdicts: readonly VerdictFact[],
  rule: SignOffRule = ONE_APPROVAL,
): {
  state: ReviewRequestState;
  decidedAt: Date | null;
} {
  const latest = new Map<string, VerdictFact>();
  for (const fact of [...verdicts].sort((a, b) => a.createdAt.getTime() - b.createdAt.getTime())) {
    if (fact.verdict !== 'comment') latest.set(fact.reviewerId, fact);
  }
  const decisive = [...latest.values()];
  const newest = (facts: VerdictFact[]) => new Date(Math.max(...facts.map((fact) => fact.createdAt.getTime())));
  const objections = decisive.filter((fact) => fact.verdict === 'request-changes');
  if (objections.length > 0) return { state: 'changes-requested', decidedAt: newest(objections) };
  const approvals = decisive.filter(
    (fact) => fact.verdict === 'approve' && (rule.approvers === null || rule.approvers.includes(fact.reviewerId)),
  );
  if (approvals.length >= rule.needed) return { state: 'approved', decidedAt: newest(approvals) };
  return { state: 'open', decidedAt: null };
}

export interface ReviewFact {
  state: ReviewRequestState;
  /** The content hash of the reviewed revision. */
  contentHash: string;
  decidedAt: Date | null;
}

/**
 * The model's review state from its latest revision and every review of the model.
 * Reviews of the same content as the latest revision decide (the most recent decision
 * wins); an approval of other content only makes the model stale.
 */
export function modelReviewState(
  latest: { contentHash: string; errorCount: number },
  reviews: readonly ReviewFact[],
): ReviewState {
  const current = reviews.filter((review) => review.contentHash === latest.contentHash);
  const decided = current
    .filter((review) => review.state !== 'open' && review.decidedAt)
    .sort((a, b) => b.decidedAt!.getTime() - a.decidedAt!.getTime());
  if (decided[0]?.state === 'changes-requested') return 'changes-requested';
  // A revision with errors is never approved; a stored approval of the same content
  // (made before the checks knew better) no longer counts.
  if (decided[0]?.state === 'approved' && latest.errorCount === 0) return 'approved';
  if (current.some((review) => review.state === 'open')) return 'pending';
  if (reviews.some((review) => review.state === 'approved')) return 'stale';
  return 'none';
}

/** The sign-off rule for one review under the club's approval rules and the reviewed setup. */
export function signOffRuleFor(
  approvals: ApprovalRules,
  review: { reviewerIds: readonly string[] },
  document: unknown,
): SignOffRule {
  return {
    needed: approvalsNeeded(approvals, signOffFacts(document)),
    approvers: approvals.named_reviewers_only ? review.reviewerIds : null,
  };
}
