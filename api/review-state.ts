import { QueryTypes } from 'sequelize';
import { Revision } from './models';
import { modelReviewState, type ReviewFact } from './reviews/sign-off';

import type { ReviewState } from '@shared/contract/review-state';

export { clearedForMaiden, REVIEW_STATES, type ReviewState } from '@shared/contract/review-state';

type LatestRevision = Pick<Revision, 'id' | 'modelId' | 'contentHash' | 'errorCount'>;

/**
 * The review state of each given latest revision, keyed by revision id: the one place
 * the hangar and the model page learn it from. One query reads every review of the
 * models concerned with the content hash of the revision it reviewed.
 */
export async function reviewStateOf(revisions: readonly LatestRevision[]): Promise<Map<string, ReviewState>> {
  const states = new Map<string, ReviewState>();
  if (revisions.length === 0) return states;
  const rows = await Revision.sequelize!.query<{
    model_id: string;
    state: ReviewFact['state'];
    content_hash: string;
    decided_at: Date | null;
  }>(
    `SELECT r.model_id, r.state, rv.content_hash, r.decided_at
       FROM reviews r JOIN revisions rv ON rv.id = r.revision_id
      WHERE r.model_id = ANY($ids::uuid[])`,
    { bind: { ids: [...new Set(revisions.map((revision) => revision.modelId))] }, type: QueryTypes.SELECT },
  );
  const byModel = new Map<string, ReviewFact[]>();
  for (const row of rows) {
    byModel.set(row.model_id, [
      ...(byModel.get(row.model_id) ?? []),
      { state: row.state, contentHash: row.content_hash, decidedAt: row.decided_at ? new Date(row.decided_at) : null },
    ]);
  }
  for (const revision of revisions)
    states.set(revision.id, modelReviewState(revision, byModel.get(revision.modelId) ?? []));
  return states;
}
