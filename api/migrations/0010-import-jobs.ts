import type { MigrationParams } from 'umzug';
import type { MigrationContext } from '../db/migrate';

export async function up({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const sql = (text: string) => sequelize.query(text, { transaction });
    // A history import waiting for, or done by, the import worker (api/portability/import-worker.ts).
    // The upload stays in the row until the job ends, so any API process can take the job.
    await sql(`
      CREATE TABLE import_jobs (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        workspace_id uuid NOT NULL REFERENCES workspaces (id),
        requested_by uuid NOT NULL REFERENCES users (id),
        state text NOT NULL DEFAULT 'queued' CHECK (state IN ('queued', 'running', 'done', 'failed')),
        file_name text NOT NULL CHECK (length(file_name) <= 255),
        model_name text,
        bundle bytea,
        bundle_bytes integer NOT NULL CHECK (bundle_bytes >= 0),
        progress jsonb NOT NULL DEFAULT '{}',
        error jsonb,
        result jsonb,
        result_model_ids uuid[] NOT NULL DEFAULT '{}',
        attempts integer NOT NULL DEFAULT 0,
        created_at timestamptz NOT NULL DEFAULT now(),
        started_at timestamptz,
        finished_at timestamptz,
        updated_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT import_jobs_finished_shape CHECK (
          (state IN ('done', 'failed')) = (finished_at IS NOT NULL)
          AND (state IN ('done', 'failed')) = (bundle IS NULL)
          AND (state = 'failed') = (error IS NOT NULL)
        )
      )`);
    await sql(`CREATE INDEX import_jobs_waiting ON import_jobs (created_at) WHERE state IN ('queued', 'running')`);
    await sql(`CREATE INDEX import_jobs_workspace ON import_jobs (workspace_id, created_at DESC, id DESC)`);
  });
}

export async function down({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.query('DROP TABLE IF EXISTS import_jobs');
}
