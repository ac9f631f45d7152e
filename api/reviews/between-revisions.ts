import type { Transaction } from 'sequelize';
import { changeFindings, type ChangeFinding } from '@shared/diff';
import { setupSchema } from '@shared/format/schema';
import type { Revision } from '../models';
import { baseRevisionFor } from '../queries/review-views';

/** What a review compares against, and the mistakes that show only between the two. */
export interface BetweenRevisions {
  base: { kind: 'approved' | 'parent' | 'fork-source'; number: number } | null;
  /** null when there is no base, or when either side is not a valid setup. */
  findings: ChangeFinding[] | null;
}

/**
 * The review page's "Between these revisions" for a revision: the change findings
 * against the same base the page compares with (the last approved revision, else the
 * parent, else the fork's source), for the review-request mail.
 */
export async function betweenRevisions(revision: Revision, transaction?: Transaction): Promise<BetweenRevisions> {
  const base = await baseRevisionFor(revision, transaction);
  if (!base) return { base: null, findings: null };
  const before = setupSchema.safeParse(base.revision.document);
  const after = setupSchema.safeParse(revision.document);
  return {
    base: { kind: base.kind, number: base.revision.number },
    findings: before.success && after.success ? changeFindings(before.data, after.data) : null,
  };
}
