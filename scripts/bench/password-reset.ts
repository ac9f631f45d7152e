import { randomBytes } from 'node:crypto';
import { pathToFileURL } from 'node:url';
import { requestPasswordReset } from '@api/commands/reset-password';
import { defaultConfig } from '@api/config';
import { startMail } from '@api/mail/start-mail';
import { printAsyncBenchmarks, timingOf, type AsyncBenchmark, type AsyncTiming } from './support/async-benchmark';
import { benchDatabase, closeBenchDatabase } from './support/bench-database';
import { benchPilot } from './support/bench-fixtures';

// A password reset request for an address with an account and for one without: the two
// should take about as long, or the timing tells a stranger which addresses have
// accounts. Runs the command the route runs, one request after another, with the mail
// queued into the outbox and delivered by a local mail server as npm start does; the
// route's own rate limit (5 per address) would refuse a run this long over HTTP.
// Printed for reading side by side; no budget.

const WARM_UP = 5;
const TIMED = 100;

async function measureResets(address: (index: number) => Promise<string> | string): Promise<AsyncTiming> {
  const { sequelize } = await benchDatabase();
  const mail = await startMail({}, 'http://127.0.0.1:3000', sequelize);
  const config = defaultConfig({ jwtSecret: randomBytes(32).toString('hex') });
  try {
    const latencies: number[] = [];
    for (let index = 0; index < WARM_UP + TIMED; index += 1) {
      const email = await address(index);
      const start = performance.now();
      await requestPasswordReset(sequelize, config, mail.service, email);
      if (index >= WARM_UP) latencies.push(performance.now() - start);
    }
    await mail.delivery.drain();
    return timingOf(latencies);
  } finally {
    await mail.close();
  }
}

export const asyncBenchmarks: AsyncBenchmark[] = [
  {
    name: 'password reset request, address with an account',
    budgetOn: 'median',
    measure: async () => {
      await benchDatabase();
      const { user } = await benchPilot();
      return measureResets(() => user.email);
    },
  },
  {
    name: 'password reset request, address without an account',
    budgetOn: 'median',
    measure: () => measureResets((index) => `nobody-${index}-${randomBytes(3).toString('hex')}@bench.example`),
  },
];

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  try {
    await printAsyncBenchmarks(asyncBenchmarks);
  } finally {
    await closeBenchDatabase();
  }
}
