import type { Comparison } from '@shared/diff';
import type { RevisionModelRef, RevisionSummary } from '../models/types';

/** One side of a compare, as the API names it: the revision and its model. */
export interface CompareSideSummary extends RevisionSummary {
  model: RevisionModelRef;
}

/**
 * `GET /api/compare`: the two revisions and everything that differs between them, but
 * the text diff, which `GET /api/compare/text` sends when the reader opens it.
 */
export interface CompareResult extends Omit<Comparison, 'text'> {
  from: CompareSideSummary;
  to: CompareSideSummary;
}
