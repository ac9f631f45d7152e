import { randomBytes } from 'node:crypto';
import { pathToFileURL } from 'node:url';
import { requestPasswordReset } from '@api/commands/reset-password';
import { defaultConfig } from '@api/config';
import { startMail } from '@api/mail/start-mail';
import { printAsyncBenchmarks, timingOf, type AsyncBenchmark, type AsyncTiming } from './support/async-benchmark';
import { benchDatabase, closeBenchDatabase } from './support/bench-database';
import { benchPilot } from './support/bench-fixtures';

// A password reset request for an address with an account and for one without: the two
// must take as long, or the timing tells a stranger which addresses have accounts. Runs
// the command the route awaits, the two kinds interleaved in a shuffled order (so the
// machine's load drifts over both alike), with the delivery loop turning requests into
// mail and a local mail server catching it, as npm start does; the route's own rate
// limit (5 per address) would refuse a run this long over HTTP.
//
// The third row is the verdict: the difference of the two medians beside the noise,
// the 95th percentile of that difference when the same samples are split into two
// groups at random (a permutation test). Within budget means the difference is no
// larger than what chance alone gives.

const WARM_UP = 10;
const TIMED = 150;
const PERMUTATIONS = 2_000;

interface ResetRun {
  withAccount: number[];
  withoutAccount: number[];
}

function shuffled<T>(items: T[]): T[] {
  const copy = [...items];
  for (let i = copy.length - 1; i > 0; i -= 1) {
    const j = Math.floor(Math.random() * (i + 1));
    [copy[i], copy[j]] = [copy[j], copy[i]];
  }
  return copy;
}

const median = (values: readonly number[]) => timingOf(values).median;

async function measureResets(): Promise<ResetRun> {
  const { sequelize } = await benchDatabase();
  const { user } = await benchPilot();
  const mail = await startMail({}, 'http://127.0.0.1:3000', sequelize);
  const config = defaultConfig({ jwtSecret: randomBytes(32).toString('hex') });
  const kinds = shuffled([
    ...Array<boolean>(WARM_UP + TIMED).fill(true),
    ...Array<boolean>(WARM_UP + TIMED).fill(false),
  ]);
  const run: ResetRun = { withAccount: [], withoutAccount: [] };
  const seen = { true: 0, false: 0 };
  try {
    for (const known of kinds) {
      const email = known ? user.email : `nobody-${randomBytes(4).toString('hex')}@bench.example`;
      const start = performance.now();
      await requestPasswordReset(sequelize, config, mail.service, email);
      const elapsed = performance.now() - start;
      if (++seen[`${known}`] > WARM_UP) (known ? run.withAccount : run.withoutAccount).push(elapsed);
    }
    await mail.delivery.drain();
    return run;
  } finally {
    await mail.close();
  }
}

/** The observed difference of medians and the 95th percentile of it under random splits. */
function medianDifference(run: ResetRun): AsyncTiming & { budgetMs: number } {
  const observed = Math.abs(median(run.withAccount) - median(run.withoutAccount));
  const pooled = [...run.withAccount, ...run.withoutAccount];
  const chance: number[] = [];
  for (let i = 0; i < PERMUTATIONS; i += 1) {
    const split = shuffled(pooled);
    chance.push(Math.abs(median(split.slice(0, TIMED)) - median(split.slice(TIMED))));
  }
  const noise = timingOf(chance).p95;
  return { median: observed, p95: noise, runs: pooled.length, budgetMs: noise };
}

let measured: Promise<ResetRun> | null = null;
const resets = () => (measured ??= measureResets());

export const asyncBenchmarks: AsyncBenchmark[] = [
  {
    name: 'password reset request, address with an account',
    budgetOn: 'median',
    measure: async () => timingOf((await resets()).withAccount),
  },
  {
    name: 'password reset request, address without an account',
    budgetOn: 'median',
    measure: async () => timingOf((await resets()).withoutAccount),
  },
  {
    name: 'password reset request, difference of the two medians (p95: the noise, budget: within it)',
    budgetOn: 'median',
    measure: async () => medianDifference(await resets()),
  },
];

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  try {
    await printAsyncBenchmarks(asyncBenchmarks);
  } finally {
    await closeBenchDatabase();
  }
}
