import { chmodSync, mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '@api/app';
import { startCluster, type Cluster } from '@api/db/cluster';
import { migrate } from '@api/db/migrate';
import { createSequelize } from '@api/db/sequelize';
import { bearer, createUser, tokenFor } from './helpers/factories';
import { testConfig } from './helpers/test-app';

// This file stops its database, so it runs a cluster of its own instead of sharing
// the one the other files use.
let folder: string;
let cluster: Cluster;
let sequelize: Sequelize;
let app: Express;
const config = testConfig();

beforeAll(async () => {
  folder = mkdtempSync(path.join(os.tmpdir(), 'bindery-health-'));
  chmodSync(folder, 0o755);
  cluster = await startCluster({ dataDir: path.join(folder, 'pg'), database: 'bindery_health', throwaway: true });
  sequelize = createSequelize(cluster.url);
  await migrate(sequelize);
  app = createApp({ sequelize, config });
});

afterAll(async () => {
  await sequelize?.close();
  await cluster?.remove();
  rmSync(folder, { recursive: true, force: true });
});

describe('GET /api/health', () => {
  it('is up while the database is, goes 503 while it is away, and comes back with it', async () => {
    const user = await createUser();
    const token = tokenFor(user, config);
    const up = await request(app).get('/api/health').expect(200);
    expect(up.body).toEqual({ data: { status: 'ok', database: 'up' } });
    await request(app).get('/api/me').set(bearer(token)).expect(200);

    await cluster.stop();
    const down = await request(app).get('/api/health').expect(503);
    expect(down.body.data.database).toBe('down');
    // Routes that need the database answer 503 too, and no request takes the server down.
    const me = await request(app).get('/api/me').set(bearer(token)).expect(503);
    expect(me.body.error.code).toBe('database-unavailable');
    const signIn = await request(app)
      .post('/api/auth/sign-in')
      .send({ email: user.email, password: 'whatever-it-is' })
      .expect(503);
    expect(signIn.body.error.code).toBe('database-unavailable');

    await cluster.start();
    const again = await request(app).get('/api/health').expect(200);
    expect(again.body.data.database).toBe('up');
    await request(app).get('/api/me').set(bearer(token)).expect(200);
  });
});
