import { QueryTypes, type Sequelize } from 'sequelize';
import { changedLeafPaths, leafValues } from '@shared/lineage/leaf-paths';
import { inPreparedTransaction, preparedStatement, type PreparedRunner } from '../db/prepared';

interface RevisionRow {
  id: string;
  number: number;
  document: unknown;
  origin: string;
  source_revision_id: string | null;
}

// Enough revisions per round trip to keep memory flat on a 10,000-revision history.
const BATCH = 200;

// Every save records its changes, so the recording's statements have fixed texts and run
// as named prepared statements in the caller's transaction, past Sequelize's pipeline.

// The progress row, locked; then the document of the last revision recorded, what the
// next one is compared with, in a statement of its own. One statement cannot do both:
// when it waits for another recording's lock, it gets the row as that one left it but
// reads the revisions as they were when it began, which may lack the one now recorded.
const LOCK_PROGRESS = preparedStatement(
  'provenance-lock-progress',
  'SELECT through_number FROM provenance_progress WHERE model_id = $1 FOR UPDATE',
);
const RECORDED_DOCUMENT = preparedStatement(
  'provenance-recorded-document',
  'SELECT document FROM revisions WHERE model_id = $1 AND number = $2',
);
const NEXT_REVISIONS = preparedStatement(
  'provenance-next-revisions',
  `SELECT id, number, document, origin, source_revision_id FROM revisions
    WHERE model_id = $1 AND number > $2 ORDER BY number LIMIT ${BATCH}`,
);
const SOURCE_REVISION = preparedStatement(
  'provenance-source-revision',
  'SELECT model_id, number, document FROM revisions WHERE id = $1',
);
const SOURCE_ORIGINS = preparedStatement(
  'provenance-source-origins',
  `SELECT p.path, coalesce(c.origin_revision_id, c.revision_id) AS origin
     FROM unnest($1::text[]) AS p(path)
     CROSS JOIN LATERAL (SELECT revision_id, origin_revision_id FROM revision_changes c
                          WHERE c.model_id = $2 AND c.path = p.path AND c.number <= $3
                          ORDER BY c.number DESC LIMIT 1) AS c`,
);
const INSERT_CHANGES = preparedStatement(
  'provenance-insert-changes',
  `INSERT INTO revision_changes (model_id, path, number, revision_id, origin_revision_id)
   SELECT $1, * FROM unnest($2::text[], $3::int[], $4::uuid[], $5::uuid[])
   ON CONFLICT DO NOTHING`,
);
const ADVANCE_PROGRESS = preparedStatement(
  'provenance-advance',
  `INSERT INTO provenance_progress (model_id, through_number) VALUES ($1, $2)
   ON CONFLICT (model_id) DO UPDATE
     SET through_number = greatest(provenance_progress.through_number, excluded.through_number)`,
);

/**
 * The origin of each value a fork or a merge took from its source: the source's own
 * record of who set it (itself inherited, when the source is a fork too).
 */
async function originsInSource(
  run: PreparedRunner,
  sourceRevisionId: string,
  paths: readonly string[],
): Promise<{ document: unknown; origins: Map<string, string> }> {
  const [source] = await run<{ model_id: string; number: number; document: unknown }>(SOURCE_REVISION, [
    sourceRevisionId,
  ]);
  if (!source) return { document: undefined, origins: new Map() };
  await recordChanges(run, source.model_id);
  const rows = await run<{ path: string; origin: string }>(SOURCE_ORIGINS, [
    [...paths],
    source.model_id,
    source.number,
  ]);
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
export async function recordChanges(run: PreparedRunner, modelId: string): Promise<void> {
  const [progress] = await run<{ through_number: number }>(LOCK_PROGRESS, [modelId]);
  let through = progress?.through_number ?? 0;
  let previous: unknown;
  if (through > 0) {
    const [recorded] = await run<{ document: unknown }>(RECORDED_DOCUMENT, [modelId, through]);
    previous = recorded?.document ?? null;
  }
  const start = through;
  for (;;) {
    const batch = await run<RevisionRow>(NEXT_REVISIONS, [modelId, through]);
    if (batch.length === 0) break;
    const paths: string[] = [];
    const numbers: number[] = [];
    const revisionIds: string[] = [];
    const origins: (string | null)[] = [];
    for (const revision of batch) {
      const changed = changedLeafPaths(previous, revision.document);
      let inherited = new Map<string, string>();
      if (revision.source_revision_id && (revision.origin === 'fork' || revision.origin === 'merge')) {
        const source = await originsInSource(run, revision.source_revision_id, changed);
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
      await run(INSERT_CHANGES, [modelId, paths, numbers, revisionIds, origins]);
    }
    if (batch.length < BATCH) break;
  }
  if (through === start && progress) return;
  await run(ADVANCE_PROGRESS, [modelId, through]);
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
    await inPreparedTransaction(sequelize, (run) => recordChanges(run, modelId));
}
