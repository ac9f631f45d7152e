import type { MigrationParams } from 'umzug';
import type { MigrationContext } from '../db/migrate';

// Rate-limit counters (failed sign-ins, wrong passwords, reset requests) live in the
// database, so a restart does not clear them and every API process counts the same
// attempts. One row per limiter key and window; a row past its reset_at starts over.
export async function up({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.query(`
    CREATE TABLE rate_limits (
      key text PRIMARY KEY,
      hits integer NOT NULL CHECK (hits >= 0),
      reset_at timestamptz NOT NULL
    )`);
  await sequelize.query(`CREATE INDEX rate_limits_reset_at ON rate_limits (reset_at)`);
}

export async function down({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.query('DROP TABLE IF EXISTS rate_limits');
}
