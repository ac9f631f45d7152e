import { createHash } from 'node:crypto';
import { chmodSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { isRoot, serverUserCanReach, startCluster, type Cluster } from '@api/db/cluster';
import { dataDir, projectRoot } from './paths';

const DEFAULT_PORT = 54329;
const DATABASE = 'bindery';
const portFile = path.join(dataDir, 'pg-port');

export interface LocalDatabase {
  url: string;
  /** null when DATABASE_URL points at a server this script does not run. */
  cluster: Cluster | null;
}

// The cluster lives in .data/pg, unless the postgres user cannot get there (a clone
// under /root, say): then in a folder of its own under /var/tmp named after this
// project's path, so each clone keeps its own data across starts.
async function clusterFolder(log: (line: string) => void): Promise<string> {
  const created = !existsSync(dataDir);
  mkdirSync(dataDir, { recursive: true });
  if (created) chmodSync(dataDir, 0o755);
  if (await serverUserCanReach(dataDir)) return path.join(dataDir, 'pg');
  const hash = createHash('sha256').update(projectRoot).digest('hex').slice(0, 12);
  const fallback = path.join('/var/tmp', `bindery-${hash}`);
  mkdirSync(fallback, { recursive: true, mode: 0o755 });
  chmodSync(fallback, 0o755);
  log(`The postgres user cannot reach ${dataDir} (a folder above it lacks the execute bit for others),`);
  log(`so the database cluster is kept in ${fallback}/pg instead.`);
  return path.join(fallback, 'pg');
}

function storedPort(): number {
  if (!existsSync(portFile)) return DEFAULT_PORT;
  const port = Number(readFileSync(portFile, 'utf8').trim());
  return Number.isInteger(port) && port > 0 && port < 65536 ? port : DEFAULT_PORT;
}

/** DATABASE_URL when set; otherwise the project's own cluster, created on first use and started. */
export async function openLocalDatabase(log: (line: string) => void = console.log): Promise<LocalDatabase> {
  const external = process.env.DATABASE_URL;
  if (external) {
    log('Using the database server in DATABASE_URL.');
    return { url: external, cluster: null };
  }
  if (isRoot()) log('Running as root: PostgreSQL runs as the "postgres" user.');
  const cluster = await startCluster({
    dataDir: await clusterFolder(log),
    database: DATABASE,
    preferredPort: storedPort(),
    log,
  });
  writeFileSync(portFile, `${cluster.port}\n`);
  return { url: cluster.url, cluster };
}
