import { readdirSync } from 'node:fs';
import os from 'node:os';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { measure, type Benchmark, type SizeCheck } from './benchmark';
import type { AsyncBenchmark } from './support/async-benchmark';
import { closeBenchDatabase } from './support/bench-database';

// `npm run bench [-- WORD ...]`: runs every module in this folder that exports
// `benchmarks` (synchronous work, timed call by call), `asyncBenchmarks` (load runs
// against a real server and database) or `sizeChecks` (kilobytes), in file name order,
// and prints the median and p95 of each with its budget. A script, not a test: the numbers depend on the machine
// and its load. WORDs keep only the benchmarks whose names contain one of them.
// `--json` prints every figure as one JSON document instead (name, median, p95, budget,
// within; the machine's load average beside them), from which the README table is made.

interface BenchModule {
  benchmarks?: Benchmark[];
  asyncBenchmarks?: AsyncBenchmark[];
  sizeChecks?: SizeCheck[];
}

const folder = fileURLToPath(new URL('.', import.meta.url));
const asJson = process.argv.includes('--json');
const only = process.argv.slice(2).filter((word) => word !== '--json');

interface Figure {
  name: string;
  unit: 'ms' | 'KB';
  median: number;
  p95: number | null;
  /** Operations a second over a load run; null for timed calls and sizes. */
  per_second: number | null;
  budget: { on: 'median' | 'p95' | 'size'; below: number } | null;
  within: boolean | null;
}
const figures: Figure[] = [];
const wanted = (name: string) => only.length === 0 || only.some((word) => name.includes(word));

function ms(value: number): string {
  return `${value.toFixed(3)} ms`;
}

// Bindery's figure over the floor or peer measured in the same run on the same files:
// [ours, theirs, which figure]. The ratio is ours / theirs (below 1: Bindery is faster).
const REFERENCE_PAIRS: readonly [string, string, 'median' | 'p95'][] = [
  [
    'save a revision via the API, 20 concurrent clients',
    'floor (reference): durable 4.5 KB INSERT with pgbench, 20 clients',
    'median',
  ],
  [
    'save a revision via the API, 20 concurrent clients',
    'floor (reference): durable 4.5 KB INSERT with pgbench, 20 clients',
    'p95',
  ],
  [
    'save a revision via the API, 1 client',
    'floor (reference): durable 4.5 KB INSERT with pgbench, 1 client',
    'median',
  ],
  ['save a revision via the API, 1 client', 'git (reference): store a revision as a commit', 'median'],
  ['compare via the API, stress pair, cold', 'git (reference): git diff --no-index, stress files', 'median'],
  ['compare via the API, stress pair, warm', 'git (reference): git diff --no-index, stress files', 'median'],
  ['compare, demo revisions', 'git (reference): git diff, demo revisions', 'median'],
  ['compare, stress revisions', 'git (reference): git diff, stress revisions', 'median'],
];

function referenceRatios(all: readonly Figure[]) {
  return REFERENCE_PAIRS.flatMap(([ours, theirs, on]) => {
    const a = all.find((figure) => figure.name.startsWith(ours));
    const b = all.find((figure) => figure.name.startsWith(theirs));
    const value = (figure: Figure) => (on === 'p95' ? figure.p95 : figure.median);
    const [x, y] = a && b ? [value(a), value(b)] : [null, null];
    return a && b && x !== null && y !== null
      ? [{ name: `${a.name} / ${b.name}`, on, ours: x, theirs: y, ratio: x / y }]
      : [];
  });
}

async function main(): Promise<number> {
  // With --json, stdout carries the one JSON document alone: whatever a benchmark
  // prints on its way (progress, notes) goes to stderr.
  const printJson = (text: string) => process.stdout.write(`${text}\n`);
  if (asJson) console.log = console.error;
  const files = readdirSync(folder)
    .filter((name) => name.endsWith('.ts') && name !== 'index.ts' && name !== 'benchmark.ts')
    .sort();
  const rows: string[][] = [['benchmark', 'median', 'p95', 'per second', 'budget', '']];
  let over = 0;
  const row = (
    name: string,
    timing: { median: number; p95: number; perSecond?: number },
    budgetMs: number | undefined,
    budgetOn: 'median' | 'p95',
  ) => {
    const figure = budgetOn === 'p95' ? timing.p95 : timing.median;
    const within = budgetMs === undefined ? '' : figure < budgetMs ? 'within' : 'OVER';
    figures.push({
      name,
      unit: 'ms',
      median: timing.median,
      p95: timing.p95,
      per_second: timing.perSecond ?? null,
      budget: budgetMs === undefined ? null : { on: budgetOn, below: budgetMs },
      within: budgetMs === undefined ? null : figure < budgetMs,
    });
    if (within === 'OVER') over += 1;
    rows.push([
      name,
      ms(timing.median),
      ms(timing.p95),
      timing.perSecond === undefined ? '' : timing.perSecond.toFixed(0),
      budgetMs === undefined ? '-' : `${budgetOn} < ${Number(budgetMs.toFixed(3))} ms`,
      within,
    ]);
  };
  const modules: BenchModule[] = [];
  for (const file of files) modules.push((await import(pathToFileURL(`${folder}${file}`).href)) as BenchModule);
  for (const module of modules) {
    for (const benchmark of module.benchmarks ?? []) {
      if (wanted(benchmark.name)) row(benchmark.name, measure(benchmark), benchmark.budgetMs, 'median');
    }
    for (const benchmark of module.asyncBenchmarks ?? []) {
      if (!wanted(benchmark.name)) continue;
      const timing = await benchmark.measure();
      row(benchmark.name, timing, timing.budgetMs ?? benchmark.budgetMs, benchmark.budgetOn);
    }
  }
  const sizes: string[] = [];
  for (const module of modules) {
    for (const check of module.sizeChecks ?? []) {
      if (!wanted(check.name)) continue;
      const kilobytes = await check.measure();
      if (kilobytes >= check.budgetKb) over += 1;
      figures.push({
        name: check.name,
        unit: 'KB',
        median: kilobytes,
        p95: null,
        per_second: null,
        budget: { on: 'size', below: check.budgetKb },
        within: kilobytes < check.budgetKb,
      });
      sizes.push(
        `${check.name}: ${kilobytes.toFixed(1)} KB (budget < ${check.budgetKb} KB: ${kilobytes < check.budgetKb ? 'within' : 'OVER'})`,
      );
    }
  }
  await closeBenchDatabase();
  if (asJson) {
    const report = {
      node: process.version,
      cpus: os.availableParallelism(),
      load_average: os.loadavg(),
      figures,
      ratios: referenceRatios(figures),
    };
    printJson(JSON.stringify(report, null, 2));
    return 0;
  }
  const widths = rows[0].map((_, column) => Math.max(...rows.map((cells) => cells[column].length)));
  for (const cells of rows)
    console.log(
      cells
        .map((cell, column) => cell.padEnd(widths[column]))
        .join('  ')
        .trimEnd(),
    );
  if (sizes.length > 0) console.log(`\n${sizes.join('\n')}`);
  const ratios = referenceRatios(figures);
  if (ratios.length > 0)
    console.log(
      `\n${ratios.map((r) => `${r.name} (${r.on}): ${r.ratio.toFixed(2)} (${ms(r.ours)} vs ${ms(r.theirs)})`).join('\n')}`,
    );
  console.log(`\nNode ${process.version}, ${over === 0 ? 'all within budget' : `${over} over budget`}.`);
  return 0;
}

process.exitCode = await main();
