import type { QueryInterface, Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import { migrations } from '../migrations';

export interface MigrationContext {
  queryInterface: QueryInterface;
  sequelize: Sequelize;
}

// Several instances may start against one server at once; the first to take this
// lock migrates, the others wait and then find nothing pending.
const MIGRATION_LOCK = 74_226_001;

/** Runs `work` while holding a database-wide advisory lock (held by its own transaction). */
export async function withAdvisoryLock<T>(sequelize: Sequelize, key: number, work: () => Promise<T>): Promise<T> {
  return sequelize.transaction(async (transaction) => {
    await sequelize.query('SELECT pg_advisory_xact_lock($key)', { bind: { key }, transaction });
    return work();
  });
}

export function createMigrator(sequelize: Sequelize): Umzug<MigrationContext> {
  return new Umzug<MigrationContext>({
    migrations: migrations.map(({ name, module }) => ({ name, up: module.up, down: module.down })),
    context: { queryInterface: sequelize.getQueryInterface(), sequelize },
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

/** Applies every pending migration; answers the names applied. */
export async function migrate(sequelize: Sequelize): Promise<string[]> {
  const applied = await withAdvisoryLock(sequelize, MIGRATION_LOCK, () => createMigrator(sequelize).up());
  return applied.map((migration) => migration.name);
}
