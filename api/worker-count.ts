import os from 'node:os';

/**
 * How many API processes `npm start` runs: WEB_CONCURRENCY when set, otherwise one per
 * CPU the process may use (each process has one event loop; parse, check and compare
 * are CPU work, so one loop per core keeps every core busy).
 */
export function workerCount(env: NodeJS.ProcessEnv): number {
  const raw = env.WEB_CONCURRENCY;
  if (raw === undefined || raw === '') return Math.max(1, os.availableParallelism());
  const count = Number(raw);
  if (!Number.isInteger(count) || count < 1 || count > 64)
    throw new Error(`WEB_CONCURRENCY must be a whole number from 1 to 64, got "${raw}"`);
  return count;
}
