import { pathToFileURL } from 'node:url';
import { signSession } from '@api/auth/tokens';
import { createModel } from '@api/commands/create-model';
import type { SetupModel } from '@api/models';
import { printAsyncBenchmarks, timingOf, type AsyncBenchmark, type AsyncTiming } from './support/async-benchmark';
import { startApiProcess } from './support/api-process';
import { benchDatabase, closeBenchDatabase } from './support/bench-database';
import { requestJson } from './support/http-client';
import { benchPilot, DEMO_SETUP, demoVariant } from './support/bench-fixtures';

// Saving a revision of the demo setup through the HTTP API on loopback, 20 clients at
// once, each on a model of its own so every save lands (no 409s), each sending its
// next save as soon as the last one is answered. The API runs as `npm start` runs it:
// a cluster of WEB_CONCURRENCY processes (default one per CPU) in child processes.
// The same run with one client shows what a single save costs without queueing.
// save-floor.ts measures a bare durable INSERT of the same text in the same run.

// 600 saves before the timed ones, however many clients: the first saves after a start
// run code V8 has not optimised yet, and a server in use runs warm (with 100 the API
// still spent about half as much CPU again per timed save as with 1,500).
const WARM_UP_SAVES = 600;
const TIMED_SAVES = 50;

async function measureSaves(clients: number): Promise<AsyncTiming> {
  const { url, sequelize } = await benchDatabase();
  const { user, workspace } = await benchPilot();
  const models: SetupModel[] = [];
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
    const bases = new Map(models.map((model) => [model.id, 1]));
    // Each client's next save, from the base its last one made.
    const save = async (model: SetupModel, count: number, timed: boolean) => {
      for (let n = 0; n < count; n += 1) {
        const base = bases.get(model.id)!;
        const body = JSON.stringify({ base, message: `Bench save ${base}`, yaml: demoVariant(base) });
        const start = performance.now();
        const response = await requestJson(`${api.url}/api/models/${model.id}/revisions`, {
          method: 'POST',
          headers,
          body,
        });
        const answer = response.body as { data?: { number: number } };
        const elapsed = performance.now() - start;
        if (response.status !== 201 || !answer.data)
          throw new Error(`a bench save answered ${response.status}: ${JSON.stringify(answer)}`);
        bases.set(model.id, answer.data.number);
        if (timed) latencies.push(elapsed);
      }
    };
    // Every client warms up first, so the CPU and the rate below are the timed saves'.
    await Promise.all(models.map((model) => save(model, Math.ceil(WARM_UP_SAVES / clients), false)));
    const cpuBefore = api.cpuMs();
    const started = performance.now();
    await Promise.all(models.map((model) => save(model, TIMED_SAVES, true)));
    const seconds = (performance.now() - started) / 1000;
    const cpuAfter = api.cpuMs();
    const saves = clients * TIMED_SAVES;
    // CPU, unlike the wall clock, does not grow with other work on the machine.
    if (cpuBefore !== null && cpuAfter !== null)
      console.log(`  API CPU per save, ${clients} client(s): ${((cpuAfter - cpuBefore) / saves).toFixed(2)} ms`);
    return { ...timingOf(latencies), perSecond: saves / seconds };
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
