import type { MigrationParams } from 'umzug';
import type { MigrationContext } from '../db/migrate';

// The compare cache holds nothing that cannot be computed again, so it need not be
// durable: an unlogged table writes no WAL, and a cold compare's insert no longer waits
// for a WAL flush (fsync) before its answer goes out. After a crash PostgreSQL empties
// unlogged tables, which for a cache only means the next compares are cold.
export async function up({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.query('ALTER TABLE compare_cache SET UNLOGGED');
}

export async function down({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.query('ALTER TABLE compare_cache SET LOGGED');
}
