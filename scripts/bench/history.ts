import { pathToFileURL } from 'node:url';
import { signSession } from '@api/auth/tokens';
import { printAsyncBenchmarks, timingOf, type AsyncBenchmark, type AsyncTiming } from './support/async-benchmark';
import { requestJson } from './support/http-client';
import { startApiProcess } from './support/api-process';
import { benchDatabase, closeBenchDatabase } from './support/bench-database';
import { benchPilot, DEMO_SETUP } from './support/bench-fixtures';
import { seedHistory } from './support/seed-scale';

// The first page of the history of a model with 10,000 revisions, through the HTTP
// API on loopback, one request at a time. The revisions are inserted with one SQL
// statement (the same stored revision 1 repeated: seedHistory).

const REVISIONS = 10_000;
const WARM_UP_PAGES = 20;
const TIMED_PAGES = 200;

async function measureHistoryPage(): Promise<AsyncTiming> {
  const { url, sequelize } = await benchDatabase();
  const { user, workspace } = await benchPilot();
  const { model } = await seedHistory(sequelize, {
    workspace,
    author: user,
    name: 'Ten thousand saves',
    yaml: DEMO_SETUP,
    count: REVISIONS,
  });
  const api = await startApiProcess(url);
  try {
    const headers = { Authorization: `Bearer ${signSession(user, api.config)}` };
    const latencies: number[] = [];
    for (let page = 0; page < WARM_UP_PAGES + TIMED_PAGES; page += 1) {
      const start = performance.now();
      const response = await requestJson(`${api.url}/api/models/${model.id}/revisions`, { headers });
      const body = response.body as { data?: { number: number }[] };
      const elapsed = performance.now() - start;
      if (response.status !== 200 || body.data?.[0]?.number !== REVISIONS)
        throw new Error(`the history page answered ${response.status} starting at ${body.data?.[0]?.number}`);
      if (page >= WARM_UP_PAGES) latencies.push(elapsed);
    }
    return timingOf(latencies);
  } finally {
    await api.stop();
  }
}

export const asyncBenchmarks: AsyncBenchmark[] = [
  {
    name: `history, first page of a model with ${REVISIONS.toLocaleString('en')} revisions`,
    budgetMs: 25,
    budgetOn: 'median',
    measure: measureHistoryPage,
  },
];

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  try {
    await printAsyncBenchmarks(asyncBenchmarks);
  } finally {
    await closeBenchDatabase();
  }
}
