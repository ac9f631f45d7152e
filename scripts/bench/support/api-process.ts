import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { defaultConfig, type AppConfig } from '@api/config';

export interface ApiProcess {
  url: string;
  /** The settings the server signs sessions with, so the bench can make tokens. */
  config: AppConfig;
  /**
   * User plus system CPU time the server's processes (the primary and its workers) have
   * used so far, in ms, read from /proc; null where there is no /proc. The difference
   * over a run is the CPU the server spent on it, whatever the wall clock did.
   */
  cpuMs(): number | null;
  stop(): Promise<void>;
}

let ticksPerSecond: number | null = null;

function clockTicks(): number {
  ticksPerSecond ??= Number(execFileSync('getconf', ['CLK_TCK'], { encoding: 'utf8' }).trim()) || 100;
  return ticksPerSecond;
}

// utime and stime are the 14th and 15th fields of /proc/PID/stat, counted after the
// command name, which is in parentheses and may hold spaces.
function processCpuMs(pid: number): number {
  const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
  const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
  return ((Number(fields[11]) + Number(fields[12])) * 1000) / clockTicks();
}

function treeCpuMs(pid: number | undefined): number | null {
  if (pid === undefined) return null;
  try {
    const children = readFileSync(`/proc/${pid}/task/${pid}/children`, 'utf8').trim().split(/\s+/).filter(Boolean);
    return [pid, ...children.map(Number)].reduce((sum, id) => sum + processCpuMs(id), 0);
  } catch {
    return null;
  }
}

const entry = fileURLToPath(new URL('./bench-server.ts', import.meta.url));

/**
 * Starts the API on 127.0.0.1 against `databaseUrl` as `npm start` runs it: a cluster
 * primary in a child process and `workers` API processes (default WEB_CONCURRENCY, or
 * one per CPU) sharing its port; with `mail`, the mail queue's delivery loop and a local
 * mail server run in each worker too.
 */
export function startApiProcess(
  databaseUrl: string,
  options: { workers?: number; mail?: boolean } = {},
): Promise<ApiProcess> {
  const jwtSecret = randomBytes(32).toString('hex');
  // BENCH_PROFILE=<folder> writes a V8 CPU profile of each API process there, to see where a save's time goes.
  const profile = process.env.BENCH_PROFILE ? ['--cpu-prof', `--cpu-prof-dir=${process.env.BENCH_PROFILE}`] : [];
  const child: ChildProcess = spawn(process.execPath, [...profile, '--import', 'tsx', entry], {
    env: {
      ...process.env,
      BENCH_DATABASE_URL: databaseUrl,
      BENCH_JWT_SECRET: jwtSecret,
      ...(options.mail ? { BENCH_MAIL: '1' } : {}),
      ...(options.workers ? { WEB_CONCURRENCY: String(options.workers) } : {}),
    },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  const stop = () =>
    new Promise<void>((resolve) => {
      if (child.exitCode !== null || child.signalCode !== null) return resolve();
      child.once('exit', () => resolve());
      child.kill('SIGTERM');
    });
  return new Promise((resolve, reject) => {
    let output = '';
    child.once('error', reject);
    child.once('exit', (code) => reject(new Error(`the bench API server exited early (code ${code})`)));
    child.stdout!.on('data', (chunk: Buffer) => {
      output += chunk.toString('utf8');
      const line = output.split('\n')[0];
      if (output.includes('\n')) {
        child.removeAllListeners('exit');
        resolve({ url: line.trim(), config: defaultConfig({ jwtSecret }), cpuMs: () => treeCpuMs(child.pid), stop });
      }
    });
  });
}
