import type { Sequelize } from 'sequelize';
import { migrate } from '@api/db/migrate';
import { createSequelize } from '@api/db/sequelize';
import { seedDemo } from '@api/seed';
import { demoEnabled } from './demo';
import { openLocalDatabase } from './local-database';
import { onShutdown } from './shutdown';

/** The database npm start and npm run dev work on: running, migrated, the demo seeded once. */
export async function prepareDatabase(
  log: (line: string) => void = console.log,
): Promise<{ sequelize: Sequelize; url: string }> {
  const database = await openLocalDatabase(log);
  const { cluster } = database;
  if (cluster) onShutdown('PostgreSQL', () => cluster.stop());

  const sequelize = createSequelize(database.url);
  onShutdown('the database connections', () => sequelize.close());
  await sequelize.authenticate();

  const applied = await migrate(sequelize);
  log(applied.length > 0 ? `Applied migrations: ${applied.join(', ')}` : 'The database schema is up to date.');

  if (!demoEnabled()) {
    log('SEED_DEMO is off: no demo data.');
  } else {
    const seeded = await seedDemo(sequelize);
    if (seeded.length > 0) log(`Seeded the demo: ${seeded.join(', ')}`);
  }
  return { sequelize, url: database.url };
}
