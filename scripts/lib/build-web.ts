import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { bin, projectRoot, webDist } from './paths';
import { runCommand } from './run-command';

// What the client bundle is made from; a change to any of them calls for a new build.
const SOURCES = ['web', 'shared', 'index.html', 'vite.config.ts', 'package-lock.json', 'public'];

function newestChange(entry: string): number {
  if (!existsSync(entry)) return 0;
  const stat = statSync(entry);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const child of readdirSync(entry)) newest = Math.max(newest, newestChange(path.join(entry, child)));
  return newest;
}

export function clientIsStale(): boolean {
  const built = path.join(webDist, 'index.html');
  if (!existsSync(built)) return true;
  const builtAt = statSync(built).mtimeMs;
  return SOURCES.some((source) => newestChange(path.join(projectRoot, source)) > builtAt);
}

/** Builds the client into dist/web when it is missing or older than its sources. */
export async function buildClientIfStale(log: (line: string) => void = console.log): Promise<void> {
  if (!clientIsStale()) {
    log('The client build in dist/web is up to date.');
    return;
  }
  log('Building the client (vite build)...');
  // Pinned: a NODE_ENV inherited from a test runner would give a development bundle.
  const code = await runCommand(bin('vite'), ['build', '--logLevel', 'warn'], {
    env: { ...process.env, NODE_ENV: 'production' },
  });
  if (code !== 0) throw new Error(`vite build failed (exit ${code}).`);
}
