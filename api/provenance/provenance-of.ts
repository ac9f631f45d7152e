import { QueryTypes, type Sequelize } from 'sequelize';
import type { ProvenanceEntry } from '@shared/contract/provenance';
import { isUnder, leafValues } from '@shared/lineage/leaf-paths';
import { recordMissing } from './record-changes';

interface Row {
  path: string;
  id: string;
  number: number;
  model_id: string;
  message: string;
  created_at: Date;
  author_id: string | null;
  author_name: string | null;
  inherited: boolean;
}

// One index lookup per leaf (the newest change at or below the revision's number),
// joined with the revision that made it and its author.
const LOOKUP_SQL = `
  SELECT p.path, r.id, r.number, r.model_id, r.message, r.created_at,
         u.id AS author_id, u.name AS author_name, (c.origin_revision_id IS NOT NULL) AS inherited
    FROM unnest($paths::text[]) WITH ORDINALITY AS p(path, ord)
   CROSS JOIN LATERAL (SELECT revision_id, origin_revision_id FROM revision_changes c
                        WHERE c.model_id = $model AND c.path = p.path AND c.number <= $number
                        ORDER BY c.number DESC LIMIT 1) AS c
    JOIN revisions r ON r.id = coalesce(c.origin_revision_id, c.revision_id)
    LEFT JOIN users u ON u.id = r.author_id
   ORDER BY p.ord`;

export interface ProvenanceSubject {
  modelId: string;
  number: number;
  document: unknown;
}

/**
 * The revision that last changed each leaf setting of `revision` (only those under
 * `under` when given), by identity path. A value unchanged since revision 1 names
 * revision 1; a value that came with a fork or a merge names the source's revision and
 * is marked inherited.
 */
export async function provenanceOf(
  sequelize: Sequelize,
  revision: ProvenanceSubject,
  under?: string,
): Promise<ProvenanceEntry[]> {
  const paths = [...leafValues(revision.document).keys()].filter((path) => !under || isUnder(path, under));
  if (paths.length === 0) return [];
  await recordMissing(sequelize, revision.modelId, revision.number);
  const rows = await sequelize.query<Row>(LOOKUP_SQL, {
    bind: { paths, model: revision.modelId, number: revision.number },
    type: QueryTypes.SELECT,
  });
  return rows.map((row) => ({
    path: row.path,
    revision: { id: row.id, number: row.number, model_id: row.model_id },
    author: row.author_id ? { id: row.author_id, name: row.author_name ?? '' } : null,
    created_at: new Date(row.created_at).toISOString(),
    message: row.message,
    inherited: row.inherited,
  }));
}
