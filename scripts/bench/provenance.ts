import { pathToFileURL } from 'node:url';
import type { Sequelize } from 'sequelize';
import { signSession } from '@api/auth/tokens';
import type { User } from '@api/models';
import { printAsyncBenchmarks, timingOf, type AsyncBenchmark, type AsyncTiming } from './support/async-benchmark';
import { requestJson } from './support/http-client';
import { startApiProcess } from './support/api-process';
import { benchDatabase, closeBenchDatabase } from './support/bench-database';
import { benchPilot, DEMO_SETUP } from './support/bench-fixtures';
import { seedHistory } from './support/seed-scale';

// Where every leaf setting of the latest revision came from, and the history of one
// setting, for a model with 10,000 revisions, through the HTTP API on loopback. Each
// revision changes one of three values (a failsafe, an expo, a weight) in turn, inserted
// with one SQL statement (seedHistory), so the history is long and every value has many
// changes behind it. The first request computes the changed paths of all 10,000 revisions
// (what older histories get once, lazily); the timed requests after it are the lookup a
// save leaves ready.

const REVISIONS = 10_000;
const WARM_UP = 5;
const TIMED = 200;
// Changed by every third revision, and back by the one after it.
const FAILSAFE_PATH = 'receivers[id=fuselage].map[pin=1].failsafe';

interface LongHistory {
  url: string;
  sequelize: Sequelize;
  user: User;
  modelId: string;
}

async function seedLongHistory(name: string): Promise<LongHistory> {
  const { url, sequelize } = await benchDatabase();
  const { user, workspace } = await benchPilot();
  const { model } = await seedHistory(sequelize, {
    workspace,
    author: user,
    name,
    yaml: DEMO_SETUP,
    count: REVISIONS,
    document: `CASE chained.n % 3
                 WHEN 0 THEN jsonb_set(first.document, '{receivers,0,map,0,failsafe}', to_jsonb(1400 + chained.n % 200))
                 WHEN 1 THEN jsonb_set(first.document, '{mixes,0,expo}', to_jsonb(chained.n % 90))
                 ELSE jsonb_set(first.document, '{model,weight_g}', to_jsonb(6000 + chained.n % 500))
               END`,
  });
  return { url, sequelize, user, modelId: model.id };
}

/** Times `path` (an API path) on a fresh model with a long history; `check` throws on a wrong answer. */
async function timeOnLongHistory(
  name: string,
  path: (modelId: string) => string,
  check: (status: number, body: unknown) => void,
): Promise<AsyncTiming> {
  const { url, sequelize, user, modelId } = await seedLongHistory(name);
  const api = await startApiProcess(url);
  try {
    const headers = { Authorization: `Bearer ${signSession(user, api.config)}` };
    const latencies: number[] = [];
    for (let call = 0; call < WARM_UP + TIMED; call += 1) {
      const start = performance.now();
      const { status, body } = await requestJson(`${api.url}${path(modelId)}`, { headers });
      const elapsed = performance.now() - start;
      check(status, body);
      if (call === 0) await sequelize.query('ANALYZE revision_changes');
      if (call >= WARM_UP) latencies.push(elapsed);
    }
    return timingOf(latencies);
  } finally {
    await api.stop();
  }
}

const measureProvenance = () =>
  timeOnLongHistory(
    'Ten thousand changes',
    (modelId) => `/api/models/${modelId}/provenance`,
    (status, body) => {
      const data = (body as { data?: { revision: { number: number } }[] }).data ?? [];
      const newest = Math.max(...data.map((entry) => entry.revision.number));
      if (status !== 200 || newest < REVISIONS - 2)
        throw new Error(`provenance answered ${status}, newest change at revision ${newest}`);
    },
  );

// The first page (20 revisions, newest first) of one failsafe's history, changed in
// two revisions out of three, so the page is picked from over 6,000 changes.
const measureSettingHistory = () =>
  timeOnLongHistory(
    'Ten thousand changes, one setting',
    (modelId) => `/api/models/${modelId}/provenance/history?path=${encodeURIComponent(FAILSAFE_PATH)}`,
    (status, body) => {
      const { data = [], pagination } = body as {
        data?: { revision: { number: number } }[];
        pagination?: { total: number };
      };
      if (status !== 200 || data.length !== 20 || data[0].revision.number < REVISIONS - 2 || !pagination)
        throw new Error(`the setting's history answered ${status} with ${data.length} entries`);
      if (pagination.total < (REVISIONS * 2) / 3 - 100)
        throw new Error(`the setting's history counts ${pagination.total} changes`);
    },
  );

export const asyncBenchmarks: AsyncBenchmark[] = [
  {
    name: `provenance of every setting, model with ${REVISIONS.toLocaleString('en')} revisions`,
    budgetMs: 25,
    budgetOn: 'median',
    measure: measureProvenance,
  },
  {
    name: `history of one setting (a failsafe), first page, model with ${REVISIONS.toLocaleString('en')} revisions`,
    budgetMs: 25,
    budgetOn: 'median',
    measure: measureSettingHistory,
  },
];

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  try {
    await printAsyncBenchmarks(asyncBenchmarks);
  } finally {
    await closeBenchDatabase();
  }
}
