import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { changedLeafPaths, leafValues } from '@shared/lineage/leaf-paths';

interface RevisionRow {
  id: string;
  number: number;
  document: unknown;
  origin: string;
  source_revision_id: string | null;
}

// Enough revisions per round trip to keep memory flat on a 10,000-revision history.
const BATCH = 200;

/**
 * The origin of each value a fork or a merge took from its source: the source's own
 * record of who set it (itself inherited, when the source is a fork too).
 */
async function originsInSource(
  sequelize: Sequelize,
  sourceRevisionId: string,
  paths: readonly string[],
  transaction: Transaction,
): Promise<{ document: unknown; origins: Map<string, string> }> {
  const [source] = await sequelize.query<{ model_id: string; number: number; document: unknown }>(
    'SELECT model_id, number, document FROM revisions WHERE id = $id',
    { bind: { id: sourceRevisionId }, type: QueryTypes.SELECT, transaction },
  );
  if (!source) return { document: undefined, origins: new Map() };
  await recordChanges(sequelize, source.model_id, transaction);
  const rows = await sequelize.query<{ path: string; origin: string }>(
    `SELECT p.path, coalesce(c.origin_revision_id, c.revision_id) AS origin
       FROM unnest($paths::text[]) AS p(path)
       CROSS JOIN LATERAL (SELECT revision_id, origin_revision_id FROM revision_changes c
                            WHERE c.model_id = $model AND c.path = p.path AND c.number <= $number
                            ORDER BY c.number DESC LIMIT 1) AS c`,
    {
      bind: { paths: [...paths], model: source.model_id, number: source.number },
      type: QueryTypes.SELECT,
      transaction,
    },
  );
  return { document: source.document, origins: new Map(rows.map((row) => [row.path, row.origin])) };
}

/**
 * Records the leaf settings each revision of the model changed against its parent,
 * for every revision not yet recorded, oldest first (revision_changes, see migration
 * 0070). Each revision is computed once: the API's save records it right after
 * answering (record-later.ts), the other saves in their transaction; a revision whose
 * recording failed or never ran, or older than the table, is computed the first time
 * anyone asks (recordMissing). A value a fork or a merge brought in
 * unchanged from the source is recorded with the source revision that set it.
 */
export async function recordChanges(sequelize: Sequelize, modelId: string, transaction: Transaction): Promise<void> {
  // The progress row, locked, with the document of the last revision recorded: what the
  // next one is compared with.
  const [progress] = await sequelize.query<{ through_number: number; document: unknown }>(
    `SELECT p.through_number, r.document FROM provenance_progress p
       LEFT JOIN revisions r ON r.model_id = p.model_id AND r.number = p.through_number
      WHERE p.model_id = $model FOR UPDATE OF p`,
    { bind: { model: modelId }, type: QueryTypes.SELECT, transaction },
  );
  let through = progress?.through_number ?? 0;
  let previous: unknown = through > 0 ? progress?.document : undefined;
  const start = through;
  for (;;) {
    const batch = await sequelize.query<RevisionRow>(
      `SELECT id, number, document, origin, source_revision_id FROM revisions
        WHERE model_id = $model AND number > $through ORDER BY number LIMIT ${BATCH}`,
      { bind: { model: modelId, through }, type: QueryTypes.SELECT, transaction },
    );
    if (batch.length === 0) break;
    const paths: string[] = [];
    const numbers: number[] = [];
    const revisionIds: string[] = [];
    const origins: (string | null)[] = [];
    for (const revision of batch) {
      const changed = changedLeafPaths(previous, revision.document);
      let inherited = new Map<string, string>();
      if (revision.source_revision_id && (revision.origin === 'fork' || revision.origin === 'merge')) {
        const source = await originsInSource(sequelize, revision.source_revision_id, changed, transaction);
        const sourceLeaves = leafValues(source.document);
        const mine = leafValues(revision.document);
        inherited = new Map([...source.origins].filter(([path]) => sourceLeaves.get(path) === mine.get(path)));
      }
      for (const path of changed) {
        paths.push(path);
        numbers.push(revision.number);
        revisionIds.push(revision.id);
        origins.push(inherited.get(path) ?? null);
      }
      previous = revision.document;
      through = revision.number;
    }
    if (paths.length > 0) {
      await sequelize.query(
        `INSERT INTO revision_changes (model_id, path, number, revision_id, origin_revision_id)
         SELECT $model, * FROM unnest($paths::text[], $numbers::int[], $revisionIds::uuid[], $origins::uuid[])
         ON CONFLICT DO NOTHING`,
        { bind: { model: modelId, paths, numbers, revisionIds, origins }, transaction },
      );
    }
    if (batch.length < BATCH) break;
  }
  if (through === start && progress) return;
  await sequelize.query(
    `INSERT INTO provenance_progress (model_id, through_number) VALUES ($model, $through)
     ON CONFLICT (model_id) DO UPDATE
       SET through_number = greatest(provenance_progress.through_number, excluded.through_number)`,
    { bind: { model: modelId, through }, transaction },
  );
}

/**
 * The lazy backfill every provenance read starts with: records the model's revisions up
 * to `number` (default: its latest) when some are not recorded yet. Almost always they
 * are (each save records its own), so the write transaction is taken only when needed.
 */
export async function recordMissing(sequelize: Sequelize, modelId: string, number?: number): Promise<void> {
  const [state] = await sequelize.query<{ through: number | null; latest: number | null }>(
    `SELECT (SELECT through_number FROM provenance_progress WHERE model_id = $model) AS through,
            ${number === undefined ? '(SELECT max(number) FROM revisions WHERE model_id = $model)' : '$number::int'} AS latest`,
    { bind: { model: modelId, ...(number === undefined ? {} : { number }) }, type: QueryTypes.SELECT },
  );
  if ((state?.through ?? 0) < (state?.latest ?? 0))
    await sequelize.transaction((transaction) => recordChanges(sequelize, modelId, transaction));
}
