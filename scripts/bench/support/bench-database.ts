import { chmodSync, mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Sequelize } from 'sequelize';
import { startCluster } from '../../../api/db/cluster';
import { migrate } from '../../../api/db/migrate';
import { createSequelize } from '../../../api/db/sequelize';
import { initModels } from '../../../api/models';

export interface BenchDatabase {
  url: string;
  sequelize: Sequelize;
}

/**
 * A throwaway PostgreSQL cluster for one benchmark, made the way the API tests make
 * theirs (under the system temp folder, a free port), migrated, and removed again.
 * Unlike the tests' cluster it keeps fsync and synchronous commit on, so a save pays
 * for a durable commit as it would in use.
 */
export async function withBenchDatabase<T>(work: (database: BenchDatabase) => Promise<T>): Promise<T> {
  const folder = mkdtempSync(path.join(os.tmpdir(), 'bindery-bench-'));
  // mkdtemp makes it private to this user; as root the server runs as postgres.
  chmodSync(folder, 0o755);
  const cluster = await startCluster({ dataDir: path.join(folder, 'pg'), database: 'bindery_bench' });
  const sequelize = createSequelize(cluster.url);
  try {
    await migrate(sequelize);
    initModels(sequelize);
    return await work({ url: cluster.url, sequelize });
  } finally {
    await sequelize.close();
    await cluster.remove();
    rmSync(folder, { recursive: true, force: true });
  }
}
