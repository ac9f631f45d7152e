// One API process on a database that is already migrated (DATABASE_URL): what each
// worker of `npm start` runs, and what the multi-process tests start twice. It runs no
// migration and no seed. Its background loops (mail delivery, import jobs) claim their
// rows with FOR UPDATE SKIP LOCKED, so any number of these can share one PostgreSQL:
// everything they share lives there.
import { configFromEnv } from '@api/config';
import { createSequelize } from '@api/db/sequelize';
import { startMail } from '@api/mail/start-mail';
import { portFromEnv, startServer } from '@api/server';
import { dataDir } from './lib/paths';
import { exitOnSignals, fail, onShutdown } from './lib/shutdown';

async function main(): Promise<void> {
  exitOnSignals();
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('serve-api needs DATABASE_URL (npm start sets it for its workers).');
  const port = portFromEnv(process.env);
  const webDir = process.env.BINDERY_WEB_DIR || null;
  const config = configFromEnv(process.env, { dataDir, webDir });
  const sequelize = createSequelize(url);
  onShutdown('the database connections', () => sequelize.close());
  // Each process runs its own local mail server when no SMTP_HOST is set; in a cluster
  // the workers share its port like the web port, and every one delivers from and
  // stores into the same outbox table.
  const mail = await startMail(process.env, process.env.APP_URL ?? `http://127.0.0.1:${port}`, sequelize);
  onShutdown('the mail server', () => mail.close());
  const server = await startServer({ sequelize, config, mail: mail.service }, port, process.env.HOST ?? '127.0.0.1');
  onShutdown('the web server', () => server.close());
  // The multi-process tests read this line to learn the port (PORT=0 takes a free one).
  console.log(`[serve-api] pid ${process.pid} listening at ${server.url}`);
  process.send?.('ready');
}

main().catch(fail);
