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
import type { RunningMail } from '@api/mail/start-mail';
import { ROUTE_TABLE, routeKey } from '@api/routes/route-table';
import { startTestMail, type MailTestApp } from './helpers/mail';
import { testConfig } from './helpers/test-app';
import { buildSampleWorld, type Call } from './route-table-samples';

// Every route while PostgreSQL is away: 503 (or an answer that needs no database), never
// a 500, and the server answers again by itself once the database is back. This file
// stops its database, so it runs a cluster of its own.

let folder: string;
let cluster: Cluster;
let sequelize: Sequelize;
let mail: RunningMail;
let app: Express;
const config = testConfig();

beforeAll(async () => {
  folder = mkdtempSync(path.join(os.tmpdir(), 'bindery-outage-'));
  chmodSync(folder, 0o755);
  cluster = await startCluster({ dataDir: path.join(folder, 'pg'), database: 'bindery_outage', throwaway: true });
  sequelize = createSequelize(cluster.url);
  await migrate(sequelize);
  mail = await startTestMail(sequelize);
  app = createApp({ sequelize, config, mail: mail.service });
});

afterAll(async () => {
  await mail?.close();
  await sequelize?.close();
  await cluster?.remove();
  rmSync(folder, { recursive: true, force: true });
});

describe('every route while the database is down', () => {
  it('answers 503 database-unavailable (or what needs no database), never 500, and recovers by itself', async () => {
    const world = await buildSampleWorld({ app, config } as MailTestApp);
    const headers = await world.headersOf('owner');
    const calls: { key: string; method: string; call: Call }[] = [];
    for (const entry of ROUTE_TABLE)
      calls.push({ key: routeKey(entry), method: entry.method, call: await world.samples[routeKey(entry)]('owner') });

    await cluster.stop();
    const answers: string[] = [];
    for (const { key, method, call } of calls) {
      let test = request(app)[method.toLowerCase() as 'get' | 'post' | 'patch' | 'delete'](call.url).set(headers);
      if (call.upload) {
        for (const [name, value] of Object.entries(call.upload.fields ?? {})) test = test.field(name, value);
        test = test.attach('file', call.upload.file, { filename: call.upload.name, contentType: call.upload.type });
      } else if (call.body !== undefined) {
        test = test.send(call.body);
      }
      const response = await test;
      const code = key === 'GET /api/health' ? response.body.data?.database : response.body.error?.code;
      answers.push(`${key} ${response.status} ${code ?? ''}`.trim());
    }
    expect(
      answers.filter((answer) => / 5\d\d/.test(answer) && !/ 503 (database-unavailable|down)$/.test(answer)),
      'answers other than 503 database-unavailable',
    ).toEqual([]);
    // Only the routes that never touch the database answer anything but 503 (sign-out
    // records the ended session, so it needs the database too).
    expect(answers.filter((answer) => !/ 503 /.test(answer))).toEqual([
      'POST /api/check 200',
      'GET /api/schema/setup-1.json 200',
    ]);

    await cluster.start();
    await request(app).get('/api/health').expect(200);
    await request(app).get(`/api/models/${world.modelId}`).set(headers).expect(200);
  });
});
