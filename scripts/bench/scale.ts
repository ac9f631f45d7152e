import { readFileSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
import { signSession } from '@api/auth/tokens';
import { Membership, Workspace, type User } from '@api/models';
import { printAsyncBenchmarks, type AsyncBenchmark, type AsyncTiming } from './support/async-benchmark';
import { startApiProcess } from './support/api-process';
import { benchDatabase, closeBenchDatabase } from './support/bench-database';
import { benchPilot, DEMO_SETUP } from './support/bench-fixtures';
import { seedHangar, seedLongHistory, seedShelf } from './support/seed-scale';
import { ok, timeGets, type TimedGet } from './support/time-requests';

// Scale in data rather than load: a hangar of 10,000 models, a shelf of 2,000
// receivers, a history of 100,000 revisions on one model and a compare across it, read
// through the HTTP API (the multi-process server) one request at a time. The data is
// seeded once per run with one INSERT ... SELECT per table (support/seed-scale.ts).

const MODELS = 10_000;
const RECEIVERS = 2_000;
const REVISIONS = 100_000;
const WARM_UP = 10;
const TIMED = 100;

// The long history's revisions are the smallest valid setup, so 100,000 rows stay a
// about 200 megabytes; the hangar's models carry the demo setup.
const SMALL_SETUP = readFileSync(new URL('../../fixtures/valid/boat-centre-stop.yaml', import.meta.url), 'utf8');

interface ScaleData {
  user: User;
  hangar: Workspace;
  shelf: Workspace;
  history: { modelId: string; firstId: string; lastId: string };
}

let seeded: Promise<ScaleData> | null = null;

function scaleData(): Promise<ScaleData> {
  seeded ??= (async () => {
    const { sequelize } = await benchDatabase();
    const started = performance.now();
    const { user, workspace: hangar } = await benchPilot();
    await seedHangar(sequelize, { workspace: hangar, author: user, yaml: DEMO_SETUP, count: MODELS });
    const shelf = await Workspace.create({ name: 'Bench shelf' });
    await Membership.create({ workspaceId: shelf.id, userId: user.id, role: 'editor' });
    await seedShelf(sequelize, { workspace: shelf, author: user, count: RECEIVERS });
    const history = await seedLongHistory(sequelize, {
      workspace: shelf,
      author: user,
      yaml: SMALL_SETUP,
      lastYaml: SMALL_SETUP.replace('weight_g: 2800', 'weight_g: 2950').replace(
        '{ id: rudder, from: steering-wheel, to: 1 }',
        '{ id: rudder, from: steering-wheel, to: 1, expo: 20 }',
      ),
      count: REVISIONS,
      name: 'One hundred thousand saves',
    });
    console.error(`scale data seeded in ${((performance.now() - started) / 1000).toFixed(1)} s`);
    return {
      user,
      hangar,
      shelf,
      history: { modelId: history.model.id, firstId: history.first.id, lastId: history.last.id },
    };
  })();
  return seeded;
}

async function againstApi(
  requests: (data: ScaleData, api: string) => TimedGet[],
  before?: () => Promise<void>,
): Promise<AsyncTiming> {
  const data = await scaleData();
  const { url } = await benchDatabase();
  const api = await startApiProcess(url);
  try {
    const headers = { Authorization: `Bearer ${signSession(data.user, api.config)}` };
    return await timeGets(headers, requests(data, api.url), { warmUp: WARM_UP, before });
  } finally {
    await api.stop();
  }
}

const times = <T>(count: number, make: (index: number) => T): T[] => Array.from({ length: count }, (_, i) => make(i));

export const asyncBenchmarks: AsyncBenchmark[] = [
  {
    name: `hangar, first page of ${MODELS.toLocaleString('en')} models`,
    budgetMs: 25,
    budgetOn: 'median',
    measure: () =>
      againstApi((data, api) =>
        times(WARM_UP + TIMED, () => ({
          url: `${api}/api/workspaces/${data.hangar.id}/models`,
          check: ok('the hangar', (body: { pagination: { total: number } }) => body.pagination.total === MODELS),
        })),
      ),
  },
  {
    name: `shelf, first page of ${RECEIVERS.toLocaleString('en')} receivers`,
    budgetMs: 25,
    budgetOn: 'median',
    measure: () =>
      againstApi((data, api) =>
        times(WARM_UP + TIMED, () => ({
          url: `${api}/api/workspaces/${data.shelf.id}/receivers`,
          check: ok('the shelf', (body: { pagination: { total: number } }) => body.pagination.total === RECEIVERS),
        })),
      ),
  },
  {
    name: `history of ${REVISIONS.toLocaleString('en')} revisions, first page and keyset pages further back`,
    budgetMs: 25,
    budgetOn: 'median',
    measure: () =>
      againstApi((data, api) =>
        times(WARM_UP + TIMED, (index) => {
          // Every other request pages back from a point spread over the whole history.
          const before = index % 2 === 0 ? null : 1 + ((index * 7919) % REVISIONS);
          return {
            url: `${api}/api/models/${data.history.modelId}/revisions${before ? `?before=${before}` : ''}`,
            check: ok('the history', (body: { data: { number: number }[] }) =>
              before ? body.data[0]?.number === before - 1 : body.data[0]?.number === REVISIONS,
            ),
          };
        }),
      ),
  },
  {
    name: `compare via the API, revision 1 and ${REVISIONS.toLocaleString('en')} of one model, cold`,
    budgetMs: 10,
    budgetOn: 'median',
    measure: async () => {
      const { sequelize } = await benchDatabase();
      return againstApi(
        (data, api) =>
          times(WARM_UP + TIMED, () => ({
            url: `${api}/api/compare?from=${data.history.firstId}&to=${data.history.lastId}`,
            check: ok('the compare', (body: { data: { changes: unknown[] } }) => body.data.changes.length > 0),
          })),
        // Cold every time: the shared cache is emptied before each request.
        async () => void (await sequelize.query('DELETE FROM compare_cache')),
      );
    },
  },
];

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  try {
    await printAsyncBenchmarks(asyncBenchmarks);
  } finally {
    await closeBenchDatabase();
  }
}
