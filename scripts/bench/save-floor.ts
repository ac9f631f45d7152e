import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { spawnSync } from 'node:child_process';
import { printAsyncBenchmarks, timingOf, type AsyncBenchmark, type AsyncTiming } from './support/async-benchmark';
import { benchDatabase, closeBenchDatabase } from './support/bench-database';
import { DEMO_SETUP } from './support/bench-fixtures';

// The floor under a save: PostgreSQL's own pgbench inserting the demo setup's text
// (4.5 KB, the file every save bench sends) into a bare table with a durable commit,
// on the bench cluster (fsync and synchronous commit on), 1 client and 20 clients.
// No API, no parse, no check: what one durable row costs on this machine, measured in
// the same run as the saves, so index.ts can print each save's ratio to it.

const TRANSACTIONS = 2_000;

/** pgbench's per-transaction log (-l): the third field is the latency in microseconds. */
function latenciesFrom(folder: string): number[] {
  return readdirSync(folder)
    .filter((name) => name.startsWith('floor.'))
    .flatMap((name) => readFileSync(path.join(folder, name), 'utf8').trim().split('\n'))
    .filter((line) => line.length > 0)
    .map((line) => Number(line.split(' ')[2]) / 1000);
}

async function measureFloor(clients: number): Promise<AsyncTiming> {
  const { url, sequelize, binDir } = await benchDatabase();
  const pgbench = path.join(binDir, 'pgbench');
  if (!existsSync(pgbench)) throw new Error(`pgbench is not in ${binDir}`);
  await sequelize.query('CREATE TABLE IF NOT EXISTS bench_floor (id bigserial PRIMARY KEY, body text NOT NULL)');
  const folder = mkdtempSync(path.join(os.tmpdir(), 'bindery-floor-'));
  try {
    const script = path.join(folder, 'insert.sql');
    if (DEMO_SETUP.includes('$floor$')) throw new Error('the demo setup contains the quote tag');
    writeFileSync(script, `INSERT INTO bench_floor (body) VALUES ($floor$${DEMO_SETUP}$floor$);\n`);
    const target = new URL(url);
    const result = spawnSync(
      pgbench,
      [
        '--no-vacuum',
        `--host=${target.hostname}`,
        `--port=${target.port}`,
        `--username=${decodeURIComponent(target.username)}`,
        `--file=${script}`,
        `--client=${clients}`,
        `--jobs=${Math.min(clients, os.availableParallelism())}`,
        `--transactions=${Math.ceil(TRANSACTIONS / clients)}`,
        '--log',
        `--log-prefix=${path.join(folder, 'floor')}`,
        decodeURIComponent(target.pathname.slice(1)),
      ],
      { cwd: folder, encoding: 'utf8' },
    );
    if (result.status !== 0) throw new Error(`pgbench failed: ${result.stderr || result.stdout}`);
    const tps = /tps = ([\d.]+) \(without initial connection time\)/.exec(result.stdout);
    return { ...timingOf(latenciesFrom(folder)), perSecond: tps ? Number(tps[1]) : undefined };
  } finally {
    rmSync(folder, { recursive: true, force: true });
  }
}

export const asyncBenchmarks: AsyncBenchmark[] = [
  {
    name: 'floor (reference): durable 4.5 KB INSERT with pgbench, 20 clients',
    budgetOn: 'median',
    measure: () => measureFloor(20),
  },
  {
    name: 'floor (reference): durable 4.5 KB INSERT with pgbench, 1 client',
    budgetOn: 'median',
    measure: () => measureFloor(1),
  },
];

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  try {
    await printAsyncBenchmarks(asyncBenchmarks);
  } finally {
    await closeBenchDatabase();
  }
}
