import { spawn } from 'node:child_process';
import path from 'node:path';
import pg from 'pg';
import { findPostgresBinaries } from '@api/db/cluster';
import { openLocalDatabase } from './local-database';

// The database npm run backup and npm run restore work on: DATABASE_URL when set,
// otherwise npm start's own cluster, left running or stopped as it was found.

export interface BackupTarget {
  url: string;
  /** Where pg_dump and pg_restore are: the cluster's own, or the newest installed. */
  binDir: string;
  /** The URL without any password, for messages. */
  label: string;
  close(): Promise<void>;
}

export async function openBackupTarget(log: (line: string) => void): Promise<BackupTarget> {
  const lines: string[] = [];
  const database = await openLocalDatabase((line) => {
    lines.push(line);
    log(line);
  });
  const label = (() => {
    const url = new URL(database.url);
    url.password = '';
    return url.toString();
  })();
  if (!database.cluster)
    return { url: database.url, binDir: await findPostgresBinaries(log), label, close: async () => {} };
  const { cluster } = database;
  // The cluster says so when it adopts a server that was already up (npm start running).
  const foundRunning = lines.some((line) => line.includes('was already running'));
  return {
    url: database.url,
    binDir: cluster.binDir,
    label,
    close: () => (foundRunning ? Promise.resolve() : cluster.stop()),
  };
}

export interface Counts {
  workspaces: number;
  models: number;
  revisions: number;
}

export async function countRecords(url: string): Promise<Counts> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const { rows } = await client.query<{ workspaces: string; models: string; revisions: string }>(
      `SELECT (SELECT count(*) FROM workspaces) AS workspaces, (SELECT count(*) FROM models) AS models, (SELECT count(*) FROM revisions) AS revisions`,
    );
    return {
      workspaces: Number(rows[0].workspaces),
      models: Number(rows[0].models),
      revisions: Number(rows[0].revisions),
    };
  } finally {
    await client.end();
  }
}

/** Other sessions on the database (a running npm start): a restore under them would fail or confuse them. */
export async function otherSessions(url: string): Promise<number> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const { rows } = await client.query<{ n: string }>(
      'SELECT count(*) AS n FROM pg_stat_activity WHERE datname = current_database() AND pid <> pg_backend_pid()',
    );
    return Number(rows[0].n);
  } finally {
    await client.end();
  }
}

/** Runs one of the PostgreSQL client programs; answers its exit code and what it said. */
export function runClient(binDir: string, program: string, args: string[]): Promise<{ code: number; output: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn(path.join(binDir, program), args, {
      stdio: ['ignore', 'pipe', 'pipe'],
      env: { ...process.env, PGCONNECT_TIMEOUT: '10' },
    });
    let output = '';
    child.stdout.on('data', (chunk) => (output += chunk));
    child.stderr.on('data', (chunk) => (output += chunk));
    child.on('error', reject);
    child.on('exit', (code) => resolve({ code: code ?? 1, output }));
  });
}

export const formatCounts = (counts: Counts): string =>
  `${counts.workspaces} workspaces, ${counts.models} models, ${counts.revisions} revisions`;
