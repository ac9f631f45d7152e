import { randomBytes } from 'node:crypto';
import { chmodSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { defaultConfig } from '@api/config';
import { startCluster } from '@api/db/cluster';
import { migrate } from '@api/db/migrate';
import { startMail, type RunningMail } from '@api/mail/start-mail';
import { createSequelize } from '@api/db/sequelize';
import { seedDemo } from '@api/seed';
import { startServer } from '@api/server';
import { buildClientIfStale } from '../../scripts/lib/build-web';
import { webDist } from '../../scripts/lib/paths';

declare module 'vitest' {
  export interface ProvidedContext {
    /** Where the app under test listens, e.g. http://127.0.0.1:41234 */
    e2eBaseUrl: string;
  }
}

/** A port free right now, so the mail links can name the app's address before it listens. */
function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      probe.close(() => resolve(port));
    });
  });
}

// The built app as npm start serves it, on a free port, against a throwaway cluster
// with the demo seeded and a local mail server whose catch the Outbox shows; nothing of
// npm start's .data/ is used.
export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  await buildClientIfStale((line) => console.log(`[e2e] ${line}`));
  const folder = mkdtempSync(path.join(os.tmpdir(), 'bindery-e2e-'));
  chmodSync(folder, 0o755);
  const cluster = await startCluster({ dataDir: path.join(folder, 'pg'), database: 'bindery_e2e', throwaway: true });
  const sequelize = createSequelize(cluster.url);
  let mail: RunningMail | null = null;
  const teardown = async () => {
    await mail?.close();
    await sequelize.close();
    await cluster.remove();
    rmSync(folder, { recursive: true, force: true });
  };
  try {
    await migrate(sequelize);
    await seedDemo(sequelize);
    const config = defaultConfig({
      jwtSecret: randomBytes(32).toString('hex'),
      webDir: webDist,
      signInLimits: { windowMs: 60_000, perAccount: 50, perAccountAnyAddress: 200, perAddress: 200 },
    });
    const port = await freePort();
    // Only the local catch: an SMTP_HOST of the caller's must not receive test mail.
    mail = await startMail({}, `http://127.0.0.1:${port}`, sequelize, { pollMs: 200 });
    const server = await startServer({ sequelize, config, mail: mail.service }, port);
    project.provide('e2eBaseUrl', server.url);
    return async () => {
      await server.close();
      await teardown();
    };
  } catch (error) {
    await teardown();
    throw error;
  }
}
