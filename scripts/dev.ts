// npm run dev: the same database setup as npm start, the API on PORT (3000), and
// Vite's dev server with hot reload proxying /api to it (vite.config.ts).
import { spawn } from 'node:child_process';
import { configFromEnv } from '@api/config';
import { startMail } from '@api/mail/start-mail';
import { portFromEnv, startServer } from '@api/server';
import { printDemoSignIns } from './lib/demo';
import { bin, dataDir, projectRoot } from './lib/paths';
import { prepareDatabase } from './lib/prepare-database';
import { stopChild } from './lib/run-command';
import { exitOnSignals, fail, onShutdown, shutdown } from './lib/shutdown';

async function main(): Promise<void> {
  exitOnSignals();
  const port = portFromEnv(process.env);
  const config = configFromEnv(process.env, { dataDir, webDir: null });
  const { sequelize } = await prepareDatabase();
  // Links in mails lead to Vite's dev server, which serves the client here.
  const mail = await startMail(process.env, 'http://127.0.0.1:5173', sequelize);
  onShutdown('the mail server', () => mail.close());
  const server = await startServer({ sequelize, config, mail: mail.service }, port);
  onShutdown('the API server', () => server.close());
  console.log(`API listening on ${server.url}`);
  console.log(mail.description);
  printDemoSignIns();

  const vite = spawn(bin('vite'), ['--host', '127.0.0.1'], {
    cwd: projectRoot,
    stdio: 'inherit',
    env: { ...process.env, API_PORT: String(port) },
  });
  onShutdown('the Vite dev server', () => stopChild(vite));
  vite.on('exit', (code) => {
    console.log(`Vite exited (${code ?? 'signal'}); stopping.`);
    void shutdown().then(() => process.exit(code ?? 0));
  });
}

main().catch(fail);
