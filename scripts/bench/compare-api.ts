import { pathToFileURL } from 'node:url';
import { signSession } from '@api/auth/tokens';
import { createModel } from '@api/commands/create-model';
import { saveRevision } from '@api/commands/save-revision';
import type { User } from '@api/models';
import { printAsyncBenchmarks, type AsyncBenchmark, type AsyncTiming } from './support/async-benchmark';
import { startApiProcess } from './support/api-process';
import { benchDatabase, closeBenchDatabase } from './support/bench-database';
import { benchPilot } from './support/bench-fixtures';
import { distinctStressPairs } from './support/compare-pairs';
import { ok, timeGets, type TimedGet } from './support/time-requests';

// GET /api/compare of the stress pair (32 channels, 4 receivers, 300 mixes; the same
// edits as compare.ts, whose `git diff --no-index` of the two files is the peer) through
// the HTTP API of the multi-process server, one request at a time. Ten distinct pairs
// (ten content-hash pairs) in one model: cold empties the shared compare cache before
// each round of ten, so every request computes; warm reads what the first round stored.

const PAIRS = 10;
const ROUNDS = 6;

interface PairData {
  user: User;
  pairs: [string, string][];
}

let seeded: Promise<PairData> | null = null;

function pairData(): Promise<PairData> {
  seeded ??= (async () => {
    const { sequelize } = await benchDatabase();
    const { user, workspace } = await benchPilot();
    const texts = distinctStressPairs(PAIRS).flat();
    const { model, revision } = await createModel(sequelize, {
      workspace,
      author: user,
      name: 'Stress compares',
      yaml: texts[0],
    });
    const ids = [revision.id];
    for (let index = 1; index < texts.length; index += 1)
      ids.push(
        (await saveRevision(sequelize, { modelId: model.id, author: user, base: index, yaml: texts[index] })).id,
      );
    return { user, pairs: Array.from({ length: PAIRS }, (_, index) => [ids[2 * index], ids[2 * index + 1]]) };
  })();
  return seeded;
}

async function measureCompares(cold: boolean): Promise<AsyncTiming> {
  const { url, sequelize } = await benchDatabase();
  const data = await pairData();
  const api = await startApiProcess(url);
  try {
    const headers = { Authorization: `Bearer ${signSession(data.user, api.config)}`, 'Accept-Encoding': 'gzip' };
    const requests: TimedGet[] = Array.from({ length: PAIRS * (ROUNDS + 1) }, (_, index) => {
      const [from, to] = data.pairs[index % PAIRS];
      return {
        url: `${api.url}/api/compare?from=${from}&to=${to}`,
        check: ok('the compare', (body: { data: { changes: unknown[] } }) => body.data.changes.length > 0),
      };
    });
    // The first round warms the processes (and, for warm, fills the cache); it is not timed.
    return await timeGets(headers, requests, {
      warmUp: PAIRS,
      before: async (index) => {
        if (index % PAIRS === 0 && (cold || index === 0)) await sequelize.query('DELETE FROM compare_cache');
      },
    });
  } finally {
    await api.stop();
  }
}

export const asyncBenchmarks: AsyncBenchmark[] = [
  {
    name: 'compare via the API, stress pair, cold (10 distinct pairs, cache emptied)',
    budgetOn: 'median',
    measure: () => measureCompares(true),
  },
  {
    name: 'compare via the API, stress pair, warm (from the compare cache)',
    budgetOn: 'median',
    measure: () => measureCompares(false),
  },
];

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  try {
    await printAsyncBenchmarks(asyncBenchmarks);
  } finally {
    await closeBenchDatabase();
  }
}
