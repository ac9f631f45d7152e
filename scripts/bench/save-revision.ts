import { pathToFileURL } from 'node:url';
import { signSession } from '@api/auth/tokens';
import { createModel } from '@api/commands/create-model';
import { printAsyncBenchmarks, timingOf, type AsyncBenchmark, type AsyncTiming } from './support/async-benchmark';
import { startApiProcess } from './support/api-process';
import { benchDatabase, closeBenchDatabase } from './support/bench-database';
import { benchPilot, DEMO_SETUP, demoVariant } from './support/bench-fixtures';

// Saving a revision of the demo setup through the HTTP API on loopback, 20 clients at
// once, each on a model of its own so every save lands (no 409s), each sending its
// next save as soon as the last one is answered. The API runs as `npm start` runs it:
// a cluster of WEB_CONCURRENCY processes (default one per CPU) in child processes.
// The same run with one client shows what a single save costs without queueing.
// save-floor.ts measures a bare durable INSERT of the same text in the same run.

const WARM_UP_SAVES = 5;
const TIMED_SAVES = 50;

async function measureSaves(clients: number): Promise<AsyncTiming> {
  const { url, sequelize } = await benchDatabase();
  const { user, workspace } = await benchPilot();
  const models = [];
  for (let client = 0; client < clients; client += 1) {
    models.push(
      (await createModel(sequelize, { workspace, author: user, name: `Bench model ${client + 1}`, yaml: DEMO_SETUP }))
        .model,
    );
  }
  const api = await startApiProcess(url);
  try {
    const headers = { Authorization: `Bearer ${signSession(user, api.config)}`, 'Content-Type': 'application/json' };
    const latencies: number[] = [];
    const started = performance.now();
    await Promise.all(
      models.map(async (model) => {
        let base = 1;
        for (let save = 0; save < WARM_UP_SAVES + TIMED_SAVES; save += 1) {
          const body = JSON.stringify({ base, message: `Bench save ${save + 1}`, yaml: demoVariant(save + 1) });
          const start = performance.now();
          const response = await fetch(`${api.url}/api/models/${model.id}/revisions`, {
            method: 'POST',
            headers,
            body,
          });
          const answer = (await response.json()) as { data?: { number: number } };
          const elapsed = performance.now() - start;
          if (response.status !== 201 || !answer.data)
            throw new Error(`a bench save answered ${response.status}: ${JSON.stringify(answer)}`);
          base = answer.data.number;
          if (save >= WARM_UP_SAVES) latencies.push(elapsed);
        }
      }),
    );
    const seconds = (performance.now() - started) / 1000;
    return { ...timingOf(latencies), perSecond: (clients * (WARM_UP_SAVES + TIMED_SAVES)) / seconds };
  } finally {
    await api.stop();
  }
}

export const asyncBenchmarks: AsyncBenchmark[] = [
  {
    name: 'save a revision via the API, 20 concurrent clients',
    budgetMs: 30,
    budgetOn: 'p95',
    measure: () => measureSaves(20),
  },
  {
    name: 'save a revision via the API, 1 client',
    budgetMs: 4,
    budgetOn: 'median',
    measure: () => measureSaves(1),
  },
];

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  try {
    await printAsyncBenchmarks(asyncBenchmarks);
  } finally {
    await closeBenchDatabase();
  }
}
