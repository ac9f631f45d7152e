import { QueryTypes, type Sequelize } from 'sequelize';
import type { ImportProgress } from './import-history';
import type { ImportResult } from './import-models';

// The rows of import_jobs (migration 0010): queued by the upload route, claimed and
// finished by the import worker, read by the job routes.

export type ImportJobState = 'queued' | 'running' | 'done' | 'failed';

export interface ImportJobError {
  status: number;
  code: string;
  message: string;
  details?: Record<string, unknown>;
}

export interface ImportJobModelResult {
  model_id: string;
  revisions: number;
  tags: number;
  hash_mismatches: ImportResult['hashMismatches'];
}

export interface ImportJobRow {
  id: string;
  workspace_id: string;
  requested_by: string;
  requested_by_name: string | null;
  state: ImportJobState;
  file_name: string;
  model_name: string | null;
  bundle_bytes: number;
  progress: Partial<ImportProgress>;
  error: ImportJobError | null;
  result: ImportJobModelResult[] | null;
  result_model_ids: string[];
  attempts: number;
  created_at: Date;
  started_at: Date | null;
  finished_at: Date | null;
}

/** A claimed job also carries its upload. */
export type ClaimedImportJob = ImportJobRow & { bundle: Buffer };

// A job whose process stopped (a crash, a kill) stays 'running' with nothing written,
// the import being one transaction; after this long without a progress report another
// process takes it again, and after MAX_ATTEMPTS it is failed instead.
const STALE_AFTER = "interval '10 minutes'";
export const MAX_ATTEMPTS = 3;

const COLUMNS = `j.id, j.workspace_id, j.requested_by, u.name AS requested_by_name, j.state, j.file_name, j.model_name,
  j.bundle_bytes, j.progress, j.error, j.result, j.result_model_ids, j.attempts, j.created_at, j.started_at, j.finished_at`;

export async function queueImportJob(
  sequelize: Sequelize,
  input: { workspaceId: string; requestedBy: string; fileName: string; modelName: string | null; bundle: Buffer },
): Promise<string> {
  const [row] = await sequelize.query<{ id: string }>(
    `INSERT INTO import_jobs (workspace_id, requested_by, file_name, model_name, bundle, bundle_bytes)
     VALUES ($workspaceId, $requestedBy, $fileName, $modelName, $bundle, $bytes) RETURNING id`,
    { bind: { ...input, bytes: input.bundle.length }, type: QueryTypes.SELECT },
  );
  return row.id;
}

/** The oldest waiting job, now running here; SKIP LOCKED lets several API processes claim side by side. */
export async function claimImportJob(sequelize: Sequelize): Promise<ClaimedImportJob | null> {
  const rows = await sequelize.query<ClaimedImportJob>(
    `WITH next AS (
       SELECT id FROM import_jobs
        WHERE state = 'queued' OR (state = 'running' AND updated_at < now() - ${STALE_AFTER})
        ORDER BY created_at, id
        LIMIT 1
        FOR UPDATE SKIP LOCKED
     )
     UPDATE import_jobs j
        SET state = 'running', attempts = j.attempts + 1, started_at = now(), updated_at = now()
       FROM next
      WHERE j.id = next.id
     RETURNING j.*`,
    { type: QueryTypes.SELECT },
  );
  return rows[0] ?? null;
}

export async function reportImportProgress(
  sequelize: Sequelize,
  id: string,
  update: Partial<ImportProgress>,
): Promise<void> {
  await sequelize.query(
    `UPDATE import_jobs SET progress = progress || $update::jsonb, updated_at = now() WHERE id = $id AND state = 'running'`,
    { bind: { id, update: JSON.stringify(update) } },
  );
}

export async function finishImportJob(sequelize: Sequelize, id: string, results: ImportResult[]): Promise<void> {
  const result: ImportJobModelResult[] = results.map((entry) => ({
    model_id: entry.model.id,
    revisions: entry.revisions,
    tags: entry.tags,
    hash_mismatches: entry.hashMismatches,
  }));
  await sequelize.query(
    `UPDATE import_jobs
        SET state = 'done', bundle = NULL, result = $result::jsonb, result_model_ids = $ids::uuid[],
            finished_at = now(), updated_at = now()
      WHERE id = $id`,
    { bind: { id, result: JSON.stringify(result), ids: result.map((entry) => entry.model_id) } },
  );
}

export async function failImportJob(sequelize: Sequelize, id: string, error: ImportJobError): Promise<void> {
  await sequelize.query(
    `UPDATE import_jobs
        SET state = 'failed', bundle = NULL, error = $error::jsonb, finished_at = now(), updated_at = now()
      WHERE id = $id`,
    { bind: { id, error: JSON.stringify(error) } },
  );
}

export async function findImportJob(
  sequelize: Sequelize,
  workspaceId: string,
  id: string,
): Promise<ImportJobRow | null> {
  const rows = await sequelize.query<ImportJobRow>(
    `SELECT ${COLUMNS} FROM import_jobs j LEFT JOIN users u ON u.id = j.requested_by
      WHERE j.workspace_id = $workspaceId AND j.id = $id`,
    { bind: { workspaceId, id }, type: QueryTypes.SELECT },
  );
  return rows[0] ?? null;
}

export async function listImportJobs(
  sequelize: Sequelize,
  workspaceId: string,
  limit: number,
): Promise<ImportJobRow[]> {
  return sequelize.query<ImportJobRow>(
    `SELECT ${COLUMNS} FROM import_jobs j LEFT JOIN users u ON u.id = j.requested_by
      WHERE j.workspace_id = $workspaceId ORDER BY j.created_at DESC, j.id DESC LIMIT $limit`,
    { bind: { workspaceId, limit }, type: QueryTypes.SELECT },
  );
}
