import { QueryTypes, type Transaction } from 'sequelize';
import { Revision } from '../models';

/**
 * Who wrote the content an approval of `revision` would sign off: the authors of every
 * revision of the model since the last approved content (other than this content), and
 * of any revision anywhere in the history with this same content hash. Saving someone
 * else's change again (a comment added, the same setup re-saved) does not launder it:
 * the pilot who first wrote it still counts as an author of what is being approved.
 */
export async function contributorsOf(
  revision: Pick<Revision, 'modelId' | 'number' | 'contentHash'>,
  transaction?: Transaction,
): Promise<Set<string>> {
  const rows = await Revision.sequelize!.query<{ author_id: string }>(
    `WITH approved AS (
       SELECT DISTINCT rv.content_hash
         FROM reviews r JOIN revisions rv ON rv.id = r.revision_id
        WHERE r.model_id = $model AND r.state = 'approved' AND rv.content_hash <> $hash),
     boundary AS (
       SELECT coalesce(max(number), 0) AS number
         FROM revisions
        WHERE model_id = $model AND number < $number AND content_hash IN (SELECT content_hash FROM approved))
     SELECT DISTINCT author_id
       FROM revisions
      WHERE model_id = $model AND number <= $number
        AND (number > (SELECT number FROM boundary) OR content_hash = $hash)`,
    {
      bind: { model: revision.modelId, number: revision.number, hash: revision.contentHash },
      type: QueryTypes.SELECT,
      transaction,
    },
  );
  return new Set(rows.map((row) => row.author_id));
}
