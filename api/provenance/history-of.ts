import { QueryTypes, type Sequelize } from 'sequelize';
import type { ProvenanceChange } from '@shared/contract/provenance';
import { recordMissing } from './record-changes';

interface Row {
  id: string;
  number: number;
  parent_id: string | null;
  model_id: string;
  message: string;
  created_at: Date;
  author_id: string | null;
  author_name: string | null;
  inherited: boolean;
  paths: string[];
  total: string;
}

// The model's changes of the setting at $path or of one under it, as isUnder reads it:
// `receivers[id=wing]` holds `receivers[id=wing].map[pin=1].failsafe`, `mix` holds no `mixes`.
const CHANGES_AT_OR_UNDER_PATH = `model_id = $model
       AND (path = $path OR starts_with(path, $path || '.') OR starts_with(path, $path || '['))`;

// The revisions of the model that changed the path or a setting under it, newest first:
// one row per revision, with the paths it changed and the revision the value came from
// (the source's when a fork or a merge brought it in unchanged). The page's revision
// numbers are picked from the matching changes alone, so only those 20 or so revisions
// are joined and aggregated however long the setting's history is.
const HISTORY_SQL = `
  WITH hits AS MATERIALIZED (
    SELECT number, revision_id, origin_revision_id, path
      FROM revision_changes
     WHERE ${CHANGES_AT_OR_UNDER_PATH}
  ), page AS (
    SELECT DISTINCT number FROM hits ORDER BY number DESC LIMIT $limit OFFSET $offset
  ), c AS (
    SELECT h.revision_id, min(h.origin_revision_id::text)::uuid AS origin_revision_id,
           bool_or(h.origin_revision_id IS NOT NULL) AS inherited, array_agg(h.path ORDER BY h.path) AS paths
      FROM hits h JOIN page USING (number)
     GROUP BY h.revision_id
  )
  SELECT own.id, own.number, own.parent_id, r.model_id, r.message, r.created_at,
         u.id AS author_id, u.name AS author_name, c.inherited, c.paths,
         (SELECT count(DISTINCT number) FROM hits) AS total
    FROM c
    JOIN revisions own ON own.id = c.revision_id
    JOIN revisions r ON r.id = coalesce(c.origin_revision_id, c.revision_id)
    LEFT JOIN users u ON u.id = r.author_id
   ORDER BY own.number DESC`;

/**
 * Every revision of a model that changed the setting at `path` (or one under it), newest
 * first, paged: the earlier history behind "since rN". Older histories are recorded
 * first (recordMissing), as for provenanceOf.
 */
export async function historyOf(
  sequelize: Sequelize,
  modelId: string,
  path: string,
  page: { limit: number; offset: number },
): Promise<{ changes: ProvenanceChange[]; total: number }> {
  await recordMissing(sequelize, modelId);
  const rows = await sequelize.query<Row>(HISTORY_SQL, {
    bind: { model: modelId, path, limit: page.limit, offset: page.offset },
    type: QueryTypes.SELECT,
  });
  let total = rows[0] ? Number(rows[0].total) : 0;
  if (rows.length === 0 && page.offset > 0) {
    const [count] = await sequelize.query<{ total: string }>(
      `SELECT count(DISTINCT revision_id) AS total FROM revision_changes WHERE ${CHANGES_AT_OR_UNDER_PATH}`,
      { bind: { model: modelId, path }, type: QueryTypes.SELECT },
    );
    total = Number(count?.total ?? 0);
  }
  return {
    total,
    changes: rows.map((row) => ({
      revision: { id: row.id, number: row.number, parent_id: row.parent_id },
      origin_model_id: row.model_id,
      author: row.author_id ? { id: row.author_id, name: row.author_name ?? '' } : null,
      created_at: new Date(row.created_at).toISOString(),
      message: row.message,
      inherited: row.inherited,
      paths: row.paths,
    })),
  };
}
