import { pathToFileURL } from 'node:url';
import { signSession } from '@api/auth/tokens';
import { bundleOf, setupCommits } from '../lib/fake-git-history';
import { printAsyncBenchmarks, timingOf, type AsyncBenchmark, type AsyncTiming } from './support/async-benchmark';
import { startApiProcess } from './support/api-process';
import { benchDatabase, closeBenchDatabase } from './support/bench-database';
import { benchPilot, demoVariant } from './support/bench-fixtures';

// /api/health, asked again and again while the same API process imports a history of
// 2,000 revisions as a job. The figure is the health check's latency during the
// import: the import yields between small batches, so it stays near an idle server's.
// The import's own time is printed beside it.

const REVISIONS = 2_000;

async function measureHealthDuringImport(): Promise<AsyncTiming> {
  const { url } = await benchDatabase();
  const { user, workspace } = await benchPilot();
  const bundle = bundleOf(setupCommits(REVISIONS, demoVariant));
  const api = await startApiProcess(url);
  try {
    const headers = { Authorization: `Bearer ${signSession(user, api.config)}` };
    const form = new FormData();
    form.append('file', new Blob([new Uint8Array(bundle)], { type: 'application/octet-stream' }), 'bench.bundle');
    const started = performance.now();
    const queued = await fetch(`${api.url}/api/workspaces/${workspace.id}/import`, {
      method: 'POST',
      headers,
      body: form,
    });
    const job = (await queued.json()) as { data?: { id: string } };
    if (queued.status !== 202 || !job.data) throw new Error(`the import answered ${queued.status}`);
    const latencies: number[] = [];
    for (;;) {
      const start = performance.now();
      const health = await fetch(`${api.url}/api/health`);
      await health.arrayBuffer();
      latencies.push(performance.now() - start);
      if (health.status !== 200) throw new Error(`health answered ${health.status} during the import`);
      const state = (await (
        await fetch(`${api.url}/api/workspaces/${workspace.id}/imports/${job.data.id}`, { headers })
      ).json()) as { data: { state: string; error: unknown } };
      if (state.data.state === 'failed') throw new Error(`the import failed: ${JSON.stringify(state.data.error)}`);
      if (state.data.state === 'done') break;
    }
    console.log(
      `  (import of ${REVISIONS} revisions took ${((performance.now() - started) / 1000).toFixed(1)} s; ${latencies.length} health checks meanwhile)`,
    );
    return timingOf(latencies);
  } finally {
    await api.stop();
  }
}

export const asyncBenchmarks: AsyncBenchmark[] = [
  {
    name: `health check while importing ${REVISIONS.toLocaleString('en')} revisions`,
    budgetMs: 250,
    budgetOn: 'p95',
    measure: measureHealthDuringImport,
  },
];

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  try {
    await printAsyncBenchmarks(asyncBenchmarks);
  } finally {
    await closeBenchDatabase();
  }
}
