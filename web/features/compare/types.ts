import type { WithChangeFindings } from '../../../shared/contract/change-finding';
import type { Comparison } from '../../../shared/diff';
import type { RevisionModelRef, RevisionSummary } from '../models/types';

/** One side of a compare, as the API names it: the revision and its model. */
export interface CompareSideSummary extends RevisionSummary {
  model: RevisionModelRef;
}

/** `GET /api/compare`: the two revisions and everything that differs between them. */
export type CompareResult = Comparison &
  WithChangeFindings & {
    from: CompareSideSummary;
    to: CompareSideSummary;
  };
