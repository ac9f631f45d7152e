import { pathToFileURL } from 'node:url';
import { signSession } from '@api/auth/tokens';
import { printAsyncBenchmarks, timingOf, type AsyncBenchmark, type AsyncTiming } from './support/async-benchmark';
import { startApiProcess } from './support/api-process';
import { benchDatabase, closeBenchDatabase } from './support/bench-database';
import { benchPilot, DEMO_SETUP } from './support/bench-fixtures';
import { seedHistory } from './support/seed-scale';

// Where every leaf setting of the latest revision came from, for a model with 10,000
// revisions, through the HTTP API on loopback. Each revision changes one of three
// values (a failsafe, an expo, a weight) in turn, inserted with one SQL statement (seedHistory), so
// the history is long and every value has many changes behind it. The first request
// computes the changed paths of all 10,000 revisions (what older histories get once,
// lazily); the timed requests after it are the lookup a save leaves ready.

const REVISIONS = 10_000;
const WARM_UP = 5;
const TIMED = 200;

async function measureProvenance(): Promise<AsyncTiming> {
  const { url, sequelize } = await benchDatabase();
  const { user, workspace } = await benchPilot();
  const { model } = await seedHistory(sequelize, {
    workspace,
    author: user,
    name: 'Ten thousand changes',
    yaml: DEMO_SETUP,
    count: REVISIONS,
    document: `CASE chained.n % 3
                 WHEN 0 THEN jsonb_set(first.document, '{receivers,0,map,0,failsafe}', to_jsonb(1400 + chained.n % 200))
                 WHEN 1 THEN jsonb_set(first.document, '{mixes,0,expo}', to_jsonb(chained.n % 90))
                 ELSE jsonb_set(first.document, '{model,weight_g}', to_jsonb(6000 + chained.n % 500))
               END`,
  });
  const api = await startApiProcess(url);
  try {
    const headers = { Authorization: `Bearer ${signSession(user, api.config)}` };
    const latencies: number[] = [];
    for (let call = 0; call < WARM_UP + TIMED; call += 1) {
      const start = performance.now();
      const response = await fetch(`${api.url}/api/models/${model.id}/provenance`, { headers });
      const body = (await response.json()) as { data?: { path: string; revision: { number: number } }[] };
      const elapsed = performance.now() - start;
      const newest = Math.max(...(body.data ?? []).map((entry) => entry.revision.number));
      if (response.status !== 200 || newest < REVISIONS - 2)
        throw new Error(`provenance answered ${response.status}, newest change at revision ${newest}`);
      if (call === 0) await sequelize.query('ANALYZE revision_changes');
      if (call >= WARM_UP) latencies.push(elapsed);
    }
    return timingOf(latencies);
  } finally {
    await api.stop();
  }
}

export const asyncBenchmarks: AsyncBenchmark[] = [
  {
    name: `provenance of every setting, model with ${REVISIONS.toLocaleString('en')} revisions`,
    budgetMs: 25,
    budgetOn: 'median',
    measure: measureProvenance,
  },
];

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  try {
    await printAsyncBenchmarks(asyncBenchmarks);
  } finally {
    await closeBenchDatabase();
  }
}
