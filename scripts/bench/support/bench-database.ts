import { chmodSync, mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Sequelize } from 'sequelize';
import { startCluster, type Cluster } from '@api/db/cluster';
import { migrate } from '@api/db/migrate';
import { createSequelize } from '@api/db/sequelize';
import { initModels } from '@api/models';

export interface BenchDatabase {
  url: string;
  sequelize: Sequelize;
  /** PostgreSQL's programs (pgbench for the floor). */
  binDir: string;
}

let opened: Promise<BenchDatabase> | null = null;
let removal: (() => Promise<void>) | null = null;

async function open(): Promise<BenchDatabase> {
  const folder = mkdtempSync(path.join(os.tmpdir(), 'bindery-bench-'));
  // mkdtemp makes it private to this user; as root the server runs as postgres.
  chmodSync(folder, 0o755);
  let cluster: Cluster | null = null;
  removal = async () => {
    await cluster?.remove();
    rmSync(folder, { recursive: true, force: true });
  };
  cluster = await startCluster({ dataDir: path.join(folder, 'pg'), database: 'bindery_bench' });
  const sequelize = createSequelize(cluster.url);
  const close = removal;
  removal = async () => {
    await sequelize.close();
    await close();
  };
  await migrate(sequelize);
  initModels(sequelize);
  return { url: cluster.url, sequelize, binDir: cluster.binDir };
}

/** Stops and deletes the bench cluster, if one was started. */
export async function closeBenchDatabase(): Promise<void> {
  const remove = removal;
  removal = null;
  opened = null;
  await remove?.();
}

/**
 * A throwaway PostgreSQL cluster for the benchmarks of this process, made the way the
 * API tests make theirs (under the system temp folder, on a free port), migrated, and
 * shared by every benchmark that asks (the models bind to one Sequelize per process).
 * Unlike the tests' cluster it keeps fsync and synchronous commit on, so a save pays
 * for a durable commit as it would in use. It is removed when the process is about to
 * exit, or by `closeBenchDatabase`.
 */
export function benchDatabase(): Promise<BenchDatabase> {
  if (!opened) {
    opened = open();
    process.once('beforeExit', () => void closeBenchDatabase());
    for (const signal of ['SIGINT', 'SIGTERM'] as const)
      process.once(signal, () => void closeBenchDatabase().finally(() => process.exit(130)));
  }
  return opened;
}
