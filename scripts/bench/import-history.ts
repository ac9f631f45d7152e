import { pathToFileURL } from 'node:url';
import { signSession } from '@api/auth/tokens';
import { bundleOf, setupCommits } from '../lib/fake-git-history';
import { printAsyncBenchmarks, timingOf, type AsyncBenchmark, type AsyncTiming } from './support/async-benchmark';
import { startApiProcess } from './support/api-process';
import { benchDatabase, closeBenchDatabase } from './support/bench-database';
import { benchPilot, demoVariant } from './support/bench-fixtures';

// /api/health, asked again and again while the same API process imports a history of
// 2,000 revisions as a job, and while it refuses hostile bundles (20,000 commits;
// messages of 3 MB). The figure is the health check's latency during the job: the
// import yields between small batches and reads git's output as a stream, so it stays
// near an idle server's. The job's own time is printed beside it.

const REVISIONS = 2_000;

/**
 * Health-check latencies while the API process takes `bundle` as an import job, until
 * the job ends in `expected`; prints how long the job took.
 */
async function healthDuring(label: string, bundle: Buffer, expected: 'done' | 'failed'): Promise<AsyncTiming> {
  const { url } = await benchDatabase();
  const { user, workspace } = await benchPilot();
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
    let ended: { state: string; error: { status: number; code: string } | null };
    for (;;) {
      const start = performance.now();
      const health = await fetch(`${api.url}/api/health`);
      await health.arrayBuffer();
      latencies.push(performance.now() - start);
      if (health.status !== 200) throw new Error(`health answered ${health.status} during the import`);
      const state = (await (
        await fetch(`${api.url}/api/workspaces/${workspace.id}/imports/${job.data.id}`, { headers })
      ).json()) as { data: typeof ended };
      if (state.data.state === 'done' || state.data.state === 'failed') {
        ended = state.data;
        break;
      }
    }
    if (ended.state !== expected) throw new Error(`the import of ${label} ended ${ended.state}, not ${expected}`);
    const how = ended.error ? `refused ${ended.error.status} ${ended.error.code}` : 'done';
    console.log(
      `  (${label}: ${how} after ${((performance.now() - started) / 1000).toFixed(2)} s; ${latencies.length} health checks meanwhile)`,
    );
    return timingOf(latencies);
  } finally {
    await api.stop();
  }
}

// The hostile bundles of issue 12: they must be refused quickly (printed) while the
// health check keeps answering within 200 ms.
const HOSTILE_COMMITS = 20_000;
const hugeMessages = () =>
  bundleOf(
    [...setupCommits(10, demoVariant)].map((commit, i) => ({
      ...commit,
      message: i === 0 ? 'First' : 'Tuned the flaps. '.repeat((3 * 1024 * 1024) / 17),
    })),
  );

export const asyncBenchmarks: AsyncBenchmark[] = [
  {
    name: `health check while importing ${REVISIONS.toLocaleString('en')} revisions`,
    budgetMs: 250,
    budgetOn: 'p95',
    measure: () =>
      healthDuring(`import of ${REVISIONS} revisions`, bundleOf(setupCommits(REVISIONS, demoVariant)), 'done'),
  },
  {
    name: `health check while refusing ${HOSTILE_COMMITS.toLocaleString('en')} commits`,
    budgetMs: 200,
    budgetOn: 'p95',
    measure: () =>
      healthDuring(
        `${HOSTILE_COMMITS} small commits`,
        bundleOf(setupCommits(HOSTILE_COMMITS, (i) => `# ${i}\n`)),
        'failed',
      ),
  },
  {
    name: 'health check while refusing commits of 3 MB messages',
    budgetMs: 200,
    budgetOn: 'p95',
    measure: () => healthDuring('9 commits of 3 MB messages', hugeMessages(), 'failed'),
  },
];

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  try {
    await printAsyncBenchmarks(asyncBenchmarks);
  } finally {
    await closeBenchDatabase();
  }
}
