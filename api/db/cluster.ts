import { spawn } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, readdirSync, rmSync, chmodSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { createDatabase } from './databases';
import { ensureDebianPackage, isRoot, MissingPackageError } from './debian-package';

export { isRoot };

// A PostgreSQL cluster of the project's own: initdb into a folder, pg_ctl on
// 127.0.0.1 and a port of its own, the unix socket kept in the data folder.
// PostgreSQL refuses to run as root, so as root every server command runs as the
// `postgres` user, who then owns the data folder.

export const SUPERUSER = 'bindery';
const PG_ROOT = '/usr/lib/postgresql';

export class ClusterError extends Error {
  override name = 'ClusterError';
}

type Log = (line: string) => void;

interface RunResult {
  code: number;
  output: string;
}

function run(
  command: string,
  args: string[],
  options: { asPostgres?: boolean; env?: NodeJS.ProcessEnv; inherit?: boolean } = {},
): Promise<RunResult> {
  const [cmd, argv] =
    options.asPostgres && isRoot() ? ['runuser', ['-u', 'postgres', '--', command, ...args]] : [command, args];
  return new Promise((resolve, reject) => {
    // cwd "/" because the postgres user may not be allowed into the caller's folder.
    const child = spawn(cmd, argv, {
      cwd: '/',
      env: options.env ?? process.env,
      stdio: options.inherit ? 'inherit' : ['ignore', 'pipe', 'pipe'],
    });
    let output = '';
    child.stdout?.on('data', (chunk) => (output += chunk));
    child.stderr?.on('data', (chunk) => (output += chunk));
    child.on('error', reject);
    // 'exit', not 'close': a postmaster started by pg_ctl may keep inherited pipes open.
    child.on('exit', (code, signal) => resolve({ code: code ?? (signal ? 128 : 1), output }));
  });
}

function newestBinDir(): string | null {
  if (!existsSync(PG_ROOT)) return null;
  const versions = readdirSync(PG_ROOT)
    .filter(
      (name) =>
        /^\d+$/.test(name) &&
        existsSync(path.join(PG_ROOT, name, 'bin', 'pg_ctl')) &&
        existsSync(path.join(PG_ROOT, name, 'bin', 'initdb')),
    )
    .sort((a, b) => Number(b) - Number(a));
  return versions.length > 0 ? path.join(PG_ROOT, versions[0], 'bin') : null;
}

/** The newest installed PostgreSQL server binaries; installs Debian's package when root. */
export async function findPostgresBinaries(log: Log = console.log): Promise<string> {
  try {
    await ensureDebianPackage({
      name: 'postgresql',
      purpose: 'The database (or set DATABASE_URL to an existing server)',
      isPresent: () => newestBinDir() !== null,
      log,
    });
  } catch (error) {
    if (error instanceof MissingPackageError) throw new ClusterError(error.message);
    throw error;
  }
  return newestBinDir() as string;
}

/** Whether the user the server will run as can reach (search) this existing folder. */
export async function serverUserCanReach(dir: string): Promise<boolean> {
  if (!isRoot()) return true;
  const result = await run('test', ['-x', dir, '-a', '-d', dir], { asPostgres: true });
  return result.code === 0;
}

function portIsFree(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const server = net.createServer();
    server.once('error', () => resolve(false));
    server.listen(port, '127.0.0.1', () => server.close(() => resolve(true)));
  });
}

/** The preferred port when it is free, otherwise one the system hands out. */
export async function freePort(preferred?: number): Promise<number> {
  if (preferred && (await portIsFree(preferred))) return preferred;
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      server.close(() => resolve(port));
    });
  });
}

const shellQuote = (value: string): string => `'${value.replace(/'/g, `'\\''`)}'`;

export interface ClusterOptions {
  dataDir: string;
  database: string;
  /** Used when free; otherwise another free port is taken (see `port` after start). */
  preferredPort?: number;
  /** Throwaway clusters trade durability for speed (fsync off). */
  throwaway?: boolean;
  log?: Log;
}

export class Cluster {
  port = 0;
  private readonly log: Log;

  constructor(
    readonly binDir: string,
    readonly options: ClusterOptions,
  ) {
    this.log = options.log ?? (() => {});
  }

  get dataDir(): string {
    return this.options.dataDir;
  }

  urlFor(database: string): string {
    return `postgres://${SUPERUSER}@127.0.0.1:${this.port}/${encodeURIComponent(database)}`;
  }

  get url(): string {
    return this.urlFor(this.options.database);
  }

  private bin(name: string): string {
    return path.join(this.binDir, name);
  }

  get initialized(): boolean {
    return existsSync(path.join(this.dataDir, 'PG_VERSION'));
  }

  async init(): Promise<void> {
    if (this.initialized) return;
    const parent = path.dirname(this.dataDir);
    mkdirSync(parent, { recursive: true });
    if (!(await serverUserCanReach(parent))) {
      throw new ClusterError(
        `The postgres user cannot reach ${parent}: every folder above it needs the execute bit for others.`,
      );
    }
    mkdirSync(this.dataDir, { recursive: true, mode: 0o700 });
    chmodSync(this.dataDir, 0o700);
    if (isRoot()) {
      const chown = await run('chown', ['-R', 'postgres:postgres', this.dataDir]);
      if (chown.code !== 0)
        throw new ClusterError(`Could not give ${this.dataDir} to the postgres user: ${chown.output.trim()}`);
    }
    this.log(`Creating a PostgreSQL cluster in ${this.dataDir}`);
    // Trust on loopback only: the cluster listens on 127.0.0.1 and serves this project alone.
    const result = await run(
      this.bin('initdb'),
      ['-D', this.dataDir, '-U', SUPERUSER, '--auth=trust', '--encoding=UTF8', '--no-locale', '--no-instructions'],
      { asPostgres: true },
    );
    if (result.code !== 0) throw new ClusterError(`initdb failed:\n${result.output.trim()}`);
  }

  private runningPort(): number | null {
    const pidFile = path.join(this.dataDir, 'postmaster.pid');
    if (!existsSync(pidFile)) return null;
    const port = Number(readFileSync(pidFile, 'utf8').split('\n')[3]);
    return Number.isInteger(port) && port > 0 ? port : null;
  }

  async isRunning(): Promise<boolean> {
    if (!this.initialized) return false;
    const status = await run(this.bin('pg_ctl'), ['-D', this.dataDir, 'status'], { asPostgres: true });
    return status.code === 0;
  }

  async start(): Promise<void> {
    if (await this.isRunning()) {
      const port = this.runningPort();
      if (port) {
        // Left running by an earlier run that did not get to stop it: adopt it.
        this.port = port;
        this.log(`PostgreSQL in ${this.dataDir} was already running on port ${port}; using it`);
        return;
      }
    }
    if (!this.port) this.port = await freePort(this.options.preferredPort);
    else if (!(await portIsFree(this.port))) this.port = await freePort();
    const socketPath = path.join(this.dataDir, `.s.PGSQL.${this.port}`);
    // Unix socket paths are limited to about 107 bytes; past that, TCP only.
    const socketDir = Buffer.byteLength(socketPath) < 100 ? this.dataDir : '';
    const settings = [
      `-c listen_addresses=127.0.0.1`,
      `-p ${this.port}`,
      `-c unix_socket_directories=${shellQuote(socketDir)}`,
      ...(this.options.throwaway ? ['-c fsync=off', '-c synchronous_commit=off', '-c full_page_writes=off'] : []),
    ].join(' ');
    const logFile = path.join(this.dataDir, 'server.log');
    const result = await run(
      this.bin('pg_ctl'),
      ['-D', this.dataDir, '-l', logFile, '-w', '-t', '60', '-o', settings, 'start'],
      { asPostgres: true },
    );
    if (result.code !== 0) {
      const tail = existsSync(logFile) ? readFileSync(logFile, 'utf8').split('\n').slice(-15).join('\n') : '';
      throw new ClusterError(
        `PostgreSQL did not start (pg_ctl exit ${result.code}):\n${result.output.trim()}\n${tail}`.trim(),
      );
    }
    this.log(`PostgreSQL is running on 127.0.0.1:${this.port}`);
  }

  async stop(): Promise<void> {
    if (!(await this.isRunning())) return;
    const result = await run(this.bin('pg_ctl'), ['-D', this.dataDir, '-m', 'fast', '-w', '-t', '60', 'stop'], {
      asPostgres: true,
    });
    if (result.code !== 0 && (await this.isRunning()))
      throw new ClusterError(`pg_ctl stop failed:\n${result.output.trim()}`);
    this.log('PostgreSQL stopped');
  }

  /** Stops the server and deletes its folder: for throwaway clusters only. */
  async remove(): Promise<void> {
    await this.stop();
    rmSync(this.dataDir, { recursive: true, force: true });
  }
}

/** Finds (or installs) the binaries, creates the cluster when new, starts it, creates the database. */
export async function startCluster(options: ClusterOptions): Promise<Cluster> {
  const cluster = new Cluster(await findPostgresBinaries(options.log), options);
  await cluster.init();
  await cluster.start();
  await createDatabase(cluster.url, options.database, { ifMissing: true });
  return cluster;
}
