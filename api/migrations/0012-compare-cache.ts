import type { MigrationParams } from 'umzug';
import type { MigrationContext } from '../db/migrate';

// Compares of two documents, keyed by their content hashes and the compare format
// they were computed in, so every API process reuses what any of them computed. The
// answer is kept as JSON text: it is spliced into the response as it is, never parsed.
// A cache, not a record: rows may be deleted at any time (no foreign keys, no trigger).
export async function up({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.query(`
    CREATE TABLE compare_cache (
      from_hash text NOT NULL CHECK (from_hash ~ '^[0-9a-f]{64}$'),
      to_hash text NOT NULL CHECK (to_hash ~ '^[0-9a-f]{64}$'),
      format_version integer NOT NULL,
      result text NOT NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (from_hash, to_hash, format_version)
    )`);
}

export async function down({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.query('DROP TABLE compare_cache');
}
