import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { fileURLToPath } from 'node:url';
import { defaultConfig, type AppConfig } from '@api/config';

export interface ApiProcess {
  url: string;
  /** The settings the server signs sessions with, so the bench can make tokens. */
  config: AppConfig;
  stop(): Promise<void>;
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
        resolve({ url: line.trim(), config: defaultConfig({ jwtSecret }), stop });
      }
    });
  });
}
