// npm start: the product on one port, from a fresh clone. The primary process ensures
// PostgreSQL (or uses DATABASE_URL), migrates, seeds the demo once and builds the client
// when stale, then forks WEB_CONCURRENCY API workers (default: one per CPU) that share
// the port through Node's cluster module; each runs scripts/serve-api.ts. Migration
// and seed run here only, once, before any worker takes a request; the workers hold no
// state of their own. A worker that dies is replaced. Ctrl-C/SIGTERM stops the
// workers, then the database this script started.
import cluster, { type Worker } from 'node:cluster';
import path from 'node:path';
import { configFromEnv } from '@api/config';
import { portFromEnv } from '@api/server';
import { workerCount } from '@api/worker-count';
import { buildClientIfStale } from './lib/build-web';
import { printDemoSignIns } from './lib/demo';
import { dataDir, projectRoot, webDist } from './lib/paths';
import { prepareDatabase } from './lib/prepare-database';
import { exitOnSignals, fail, onShutdown } from './lib/shutdown';

function stopWorkers(workers: Set<Worker>): Promise<void> {
  return new Promise((resolve) => {
    if (workers.size === 0) return resolve();
    cluster.on('exit', () => workers.size === 0 && resolve());
    for (const worker of workers) worker.process.kill('SIGTERM');
  });
}

async function main(): Promise<void> {
  exitOnSignals();
  const port = portFromEnv(process.env);
  const host = process.env.HOST ?? '127.0.0.1';
  // Creates the session secret once, before the workers read it.
  configFromEnv(process.env, { dataDir, webDir: webDist });
  const { url } = await prepareDatabase();
  await buildClientIfStale();

  const count = workerCount(process.env);
  cluster.setupPrimary({ exec: path.join(projectRoot, 'scripts', 'serve-api.ts') });
  const env = { DATABASE_URL: url, PORT: String(port), HOST: host, BINDERY_WEB_DIR: webDist };
  const workers = new Set<Worker>();
  let stopping = false;
  const fork = (): Promise<void> =>
    new Promise((resolve, reject) => {
      const worker = cluster.fork(env);
      workers.add(worker);
      let ready = false;
      // The worker says so once its web server listens (its mail server listens too).
      worker.on('message', (message) => {
        if (message !== 'ready') return;
        ready = true;
        resolve();
      });
      worker.once('exit', (code) => {
        workers.delete(worker);
        if (stopping) return;
        if (!ready) return reject(new Error(`An API worker stopped with code ${code} before it could serve.`));
        console.error(`An API worker (pid ${worker.process.pid}) stopped with code ${code}; starting another.`);
        fork().then(resolve, reject);
      });
    });
  onShutdown('the API workers', () => {
    stopping = true;
    return stopWorkers(workers);
  });
  await Promise.all(Array.from({ length: count }, fork));
  console.log(
    `\nBindery is running at http://${host}:${port} in ${count} ${count === 1 ? 'process' : 'processes'}  (Ctrl-C stops it)`,
  );
  printDemoSignIns();
}

main().catch(fail);
