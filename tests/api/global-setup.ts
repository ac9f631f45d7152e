import { chmodSync, mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { startCluster } from '@api/db/cluster';
import { migrate } from '@api/db/migrate';
import { createSequelize } from '@api/db/sequelize';

const TEMPLATE_DATABASE = 'bindery_template';

declare module 'vitest' {
  export interface ProvidedContext {
    /** URL of the throwaway server (its maintenance database); see helpers/test-database.ts */
    apiTestServerUrl: string;
    /** A migrated database each test file clones its own database from */
    apiTestTemplate: string;
  }
}

// One throwaway cluster for the whole API run, on a free port under the system temp
// folder (never .data/), holding a migrated template database. Each test file clones
// a database of its own from the template, so files run in parallel safely.
export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  const folder = mkdtempSync(path.join(os.tmpdir(), 'bindery-api-tests-'));
  // mkdtemp makes it private to this user; as root the server runs as postgres.
  chmodSync(folder, 0o755);
  const cluster = await startCluster({
    dataDir: path.join(folder, 'pg'),
    database: TEMPLATE_DATABASE,
    throwaway: true,
  });
  try {
    const sequelize = createSequelize(cluster.url);
    await migrate(sequelize);
    await sequelize.close();
  } catch (error) {
    await cluster.remove();
    throw error;
  }
  project.provide('apiTestServerUrl', cluster.urlFor('postgres'));
  project.provide('apiTestTemplate', TEMPLATE_DATABASE);
  return async () => {
    await cluster.remove();
    rmSync(folder, { recursive: true, force: true });
  };
}
