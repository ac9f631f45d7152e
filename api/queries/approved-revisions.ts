import { QueryTypes } from 'sequelize';
import type { ApprovedRevision } from '@shared/contract/review';
import { Revision } from '../models';
import { usersById } from './review-views';

/**
 * The revision of each model that is cleared to fly: the highest-numbered revision
 * without errors whose content an approved review signed off (an approval holds for a
 * later revision of the same content), with the reviewers whose standing verdict on
 * that review is an approval. Keyed by model id; a model with none is absent.
 */
export async function approvedRevisions(modelIds: readonly string[]): Promise<Map<string, ApprovedRevision>> {
  const found = new Map<string, ApprovedRevision>();
  if (modelIds.length === 0) return found;
  const rows = await Revision.sequelize!.query<{
    model_id: string;
    id: string;
    number: number;
    review_id: string;
    decided_at: Date;
  }>(
    `WITH approved AS (
       SELECT r.id AS review_id, r.model_id, rv.content_hash, r.decided_at
         FROM reviews r JOIN revisions rv ON rv.id = r.revision_id
        WHERE r.model_id = ANY($ids::uuid[]) AND r.state = 'approved')
     SELECT DISTINCT ON (x.model_id) x.model_id, x.id, x.number, a.review_id, a.decided_at
       FROM revisions x JOIN approved a ON a.model_id = x.model_id AND a.content_hash = x.content_hash
      WHERE x.error_count = 0
      ORDER BY x.model_id, x.number DESC, a.decided_at DESC`,
    { bind: { ids: [...new Set(modelIds)] }, type: QueryTypes.SELECT },
  );
  if (rows.length === 0) return found;
  const standing = await Revision.sequelize!.query<{ review_id: string; reviewer_id: string; verdict: string }>(
    `SELECT DISTINCT ON (review_id, reviewer_id) review_id, reviewer_id, verdict
       FROM review_verdicts
      WHERE review_id = ANY($ids::uuid[]) AND verdict <> 'comment'
      ORDER BY review_id, reviewer_id, created_at DESC, id DESC`,
    { bind: { ids: rows.map((row) => row.review_id) }, type: QueryTypes.SELECT },
  );
  const approvals = standing.filter((row) => row.verdict === 'approve');
  const users = await usersById(approvals.map((row) => row.reviewer_id));
  for (const row of rows) {
    found.set(row.model_id, {
      id: row.id,
      number: row.number,
      approvers: approvals
        .filter((approval) => approval.review_id === row.review_id)
        .map((approval) => ({
          id: approval.reviewer_id,
          name: users.get(approval.reviewer_id)?.name ?? 'Former member',
        })),
      decided_at: new Date(row.decided_at).toISOString(),
    });
  }
  return found;
}
