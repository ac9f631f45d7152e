import { randomBytes } from 'node:crypto';
import { pathToFileURL } from 'node:url';
import { signSession } from '@api/auth/tokens';
import { Membership, User } from '@api/models';
import { startApiProcess } from './support/api-process';
import { printAsyncBenchmarks, timingOf, type AsyncBenchmark, type AsyncTiming } from './support/async-benchmark';
import { benchDatabase, closeBenchDatabase } from './support/bench-database';
import { benchPilot } from './support/bench-fixtures';

// 12 password resets for real accounts and 12 invitations sent at once, against an API
// process with its mail queue and a local mail server, as npm start runs them: every
// answer must come without a 5xx (the run stops otherwise), and the slowest within 2 s
// (the p95 of 24 answers is the second slowest; the budget is on it). Two bursts, so
// the reset route's limit per client address (30 in 15 minutes) is not reached.

const PARALLEL = 12;
const BURSTS = 2;

async function measureBursts(): Promise<AsyncTiming> {
  const { url } = await benchDatabase();
  const { user: owner, workspace } = await benchPilot();
  await Membership.update({ role: 'owner' }, { where: { workspaceId: workspace.id, userId: owner.id } });
  const api = await startApiProcess(url, { mail: true });
  try {
    const headers = {
      Authorization: `Bearer ${signSession(owner, api.config)}`,
      'Content-Type': 'application/json',
    };
    const latencies: number[] = [];
    const timed = async (path: string, body: object, auth: boolean) => {
      const start = performance.now();
      const response = await fetch(`${api.url}${path}`, {
        method: 'POST',
        headers: auth ? headers : { 'Content-Type': 'application/json' },
        body: JSON.stringify(body),
      });
      await response.arrayBuffer();
      latencies.push(performance.now() - start);
      if (response.status >= 500) throw new Error(`${path} answered ${response.status}`);
      if (response.status !== 201 && response.status !== 202) throw new Error(`${path} answered ${response.status}`);
    };
    for (let burst = 0; burst < BURSTS; burst += 1) {
      const pilots = await Promise.all(
        Array.from({ length: PARALLEL }, () =>
          User.create({
            email: `reset-${randomBytes(4).toString('hex')}@bench.example`,
            name: 'Burst Pilot',
            passwordHash: 'not-a-password-hash',
          }),
        ),
      );
      await Promise.all([
        ...pilots.map((pilot) => timed('/api/auth/password-reset', { email: pilot.email }, false)),
        ...pilots.map(() =>
          timed(
            `/api/workspaces/${workspace.id}/invitations`,
            { email: `invitee-${randomBytes(4).toString('hex')}@bench.example`, role: 'viewer' },
            true,
          ),
        ),
      ]);
    }
    return timingOf(latencies);
  } finally {
    await api.stop();
  }
}

export const asyncBenchmarks: AsyncBenchmark[] = [
  {
    name: `${PARALLEL} parallel password resets and ${PARALLEL} parallel invitations, each answer`,
    budgetMs: 2_000,
    budgetOn: 'p95',
    measure: measureBursts,
  },
];

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  try {
    await printAsyncBenchmarks(asyncBenchmarks);
  } finally {
    await closeBenchDatabase();
  }
}
