import { readdirSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { measure, type Benchmark } from './benchmark';

// `npm run bench`: runs every module in this folder that exports `benchmarks` (in file
// name order) and prints the median and p95 of each, with its budget. A script, not a
// test: the numbers depend on the machine and its load.

const folder = fileURLToPath(new URL('.', import.meta.url));
const only = process.argv.slice(2);

function ms(value: number): string {
  return `${value.toFixed(3)} ms`;
}

async function main(): Promise<number> {
  const files = readdirSync(folder)
    .filter((name) => name.endsWith('.ts') && name !== 'index.ts')
    .sort();
  const rows: string[][] = [['benchmark', 'median', 'p95', 'budget (median)', '']];
  let over = 0;
  for (const file of files) {
    const module = (await import(pathToFileURL(`${folder}${file}`).href)) as { benchmarks?: Benchmark[] };
    for (const benchmark of module.benchmarks ?? []) {
      if (only.length > 0 && !only.some((word) => benchmark.name.includes(word))) continue;
      const timing = measure(benchmark);
      const within = benchmark.budgetMs === undefined ? '' : timing.median < benchmark.budgetMs ? 'within' : 'OVER';
      if (within === 'OVER') over += 1;
      rows.push([
        benchmark.name,
        ms(timing.median),
        ms(timing.p95),
        benchmark.budgetMs === undefined ? '-' : `< ${benchmark.budgetMs} ms`,
        within,
      ]);
    }
  }
  const widths = rows[0].map((_, column) => Math.max(...rows.map((row) => row[column].length)));
  for (const row of rows) console.log(row.map((cell, column) => cell.padEnd(widths[column])).join('  ').trimEnd());
  console.log(`\nNode ${process.version}, ${over === 0 ? 'all within budget' : `${over} over budget`}.`);
  return 0;
}

process.exitCode = await main();
