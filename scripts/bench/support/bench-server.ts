import cluster, { type Worker } from 'node:cluster';
import { defaultConfig } from '@api/config';
import { createSequelize } from '@api/db/sequelize';
import { startMail } from '@api/mail/start-mail';
import { startServer } from '@api/server';
import { workerCount } from '@api/worker-count';

// The API in processes of its own for the HTTP benchmarks and the soak, so the load
// generator does not share the server's event loops. Like `npm start`, the primary
// forks WEB_CONCURRENCY workers (default: one per CPU) with Node's cluster module; they
// share one port (port 0 in a cluster is one free port for every worker) and one
// database. The primary prints the address on the first line of stdout once every
// worker listens, replaces a worker that dies (saying so on stderr, which the soak
// counts) and stops them all on SIGTERM. BENCH_MAIL=1 adds the mail queue's delivery
// loop and a local mail server in each worker, as npm start runs them, for the soak's
// invitations.
const url = process.env.BENCH_DATABASE_URL;
const jwtSecret = process.env.BENCH_JWT_SECRET;
if (!url || !jwtSecret) throw new Error('bench-server needs BENCH_DATABASE_URL and BENCH_JWT_SECRET');

async function serveOne(databaseUrl: string, secret: string): Promise<void> {
  const sequelize = createSequelize(databaseUrl);
  const mail = process.env.BENCH_MAIL === '1' ? await startMail({}, 'http://127.0.0.1', sequelize) : null;
  const server = await startServer({ sequelize, config: defaultConfig({ jwtSecret: secret }), mail: mail?.service }, 0);
  process.send?.({ listening: server.url });
  process.on('SIGTERM', () => {
    void server
      .close()
      .then(() => mail?.close())
      .then(() => sequelize.close())
      .finally(() => process.exit(0));
  });
}

function runPrimary(count: number): void {
  const workers = new Set<Worker>();
  let stopping = false;
  let announced = false;
  const listening = new Set<Worker>();
  const fork = () => {
    const worker = cluster.fork();
    workers.add(worker);
    worker.on('message', (message: { listening?: string }) => {
      if (!message.listening) return;
      listening.add(worker);
      if (!announced && listening.size === count) {
        announced = true;
        process.stdout.write(`${message.listening}\n`);
      }
    });
    worker.once('exit', (code, signal) => {
      workers.delete(worker);
      listening.delete(worker);
      if (stopping) {
        if (workers.size === 0) process.exit(0);
        return;
      }
      process.stderr.write(`[worker-died] pid ${worker.process.pid} code ${code} signal ${signal}\n`);
      if (!announced) process.exit(1);
      fork();
    });
  };
  for (let index = 0; index < count; index += 1) fork();
  process.on('SIGTERM', () => {
    stopping = true;
    if (workers.size === 0) process.exit(0);
    for (const worker of workers) worker.process.kill('SIGTERM');
  });
}

if (cluster.isPrimary) runPrimary(workerCount(process.env));
else await serveOne(url, jwtSecret);
