// npm start: the product on one port, from a fresh clone. Ensures PostgreSQL (or uses
// DATABASE_URL), migrates, seeds the demo once, builds the client when stale, serves
// API and client beside a local mail server (unless SMTP_HOST names a real one), and on
// Ctrl-C/SIGTERM stops the servers and the database it started.
import { configFromEnv } from '../api/config';
import { startMail } from '../api/mail/start-mail';
import { portFromEnv, startServer } from '../api/server';
import { buildClientIfStale } from './lib/build-web';
import { printDemoSignIns } from './lib/demo';
import { dataDir, webDist } from './lib/paths';
import { prepareDatabase } from './lib/prepare-database';
import { exitOnSignals, fail, onShutdown } from './lib/shutdown';

async function main(): Promise<void> {
  exitOnSignals();
  const port = portFromEnv(process.env);
  const config = configFromEnv(process.env, { dataDir, webDir: webDist });
  const sequelize = await prepareDatabase();
  await buildClientIfStale();
  const mail = await startMail(process.env, `http://127.0.0.1:${port}`, sequelize);
  onShutdown('the mail server', () => mail.close());
  const server = await startServer({ sequelize, config, mail: mail.service }, port, process.env.HOST ?? '127.0.0.1');
  onShutdown('the web server', () => server.close());
  console.log(mail.description);
  console.log(`\nBindery is running at ${server.url}  (Ctrl-C stops it)`);
  printDemoSignIns();
}

main().catch(fail);
