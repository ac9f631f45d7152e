// npm run bench:table -- FILE: rewrites the performance table in README.md from the
// JSON that `npm run bench -- --json > FILE` printed, so the README shows the figures of
// one real run (the machine, its load and every ratio to a floor or peer beside them)
// and never numbers typed in by hand. The table sits between two marker comments.
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { projectRoot } from './lib/paths';

interface Figure {
  name: string;
  unit: 'ms' | 'KB';
  median: number;
  p95: number | null;
  per_second: number | null;
  budget: { on: 'median' | 'p95' | 'size'; below: number } | null;
  within: boolean | null;
}

interface Ratio {
  name: string;
  on: 'median' | 'p95';
  ours: number;
  theirs: number;
  ratio: number;
}

export interface BenchReport {
  node: string;
  cpus: number;
  load_average: number[];
  figures: Figure[];
  ratios: Ratio[];
}

const START = '<!-- bench-table:start -->';
const END = '<!-- bench-table:end -->';

function number(value: number): string {
  if (value >= 100) return value.toFixed(0);
  if (value >= 10) return value.toFixed(1);
  return value.toFixed(2);
}

function amount(value: number | null, unit: Figure['unit']): string {
  return value === null ? '' : `${number(value)} ${unit}`;
}

function budget(figure: Figure): string {
  if (!figure.budget) return '';
  const unit = figure.unit;
  const which = figure.budget.on === 'size' ? '' : `${figure.budget.on} `;
  return `${which}< ${figure.budget.below} ${unit}${figure.within ? '' : ': **not met**'}`;
}

export function benchTable(report: BenchReport): string {
  const load = report.load_average.map((value) => value.toFixed(1)).join(', ');
  const lines = [
    `Node ${report.node.replace(/^v/, '')}, ${report.cpus} CPUs, load average ${load} (1, 5, 15 minutes) when the run ended.`,
    '',
    '| what | median | p95 | per second | budget |',
    '| --- | --- | --- | --- | --- |',
    ...report.figures.map(
      (figure) =>
        `| ${figure.name} | ${amount(figure.median, figure.unit)} | ${amount(figure.p95, figure.unit)} | ${
          figure.per_second === null ? '' : figure.per_second.toFixed(0)
        } | ${budget(figure)} |`,
    ),
    '',
    'Against the floor and the peers, same run, same files (below 1: Bindery takes less time):',
    '',
    '| ours / floor or peer | figure | ours | theirs | ratio |',
    '| --- | --- | --- | --- | --- |',
    ...report.ratios.map((ratio) => {
      const [ours, theirs] = ratio.name.split(' / ');
      return `| ${ours} / ${theirs} | ${ratio.on} | ${number(ratio.ours)} ms | ${number(ratio.theirs)} ms | ${ratio.ratio.toFixed(2)} |`;
    }),
  ];
  return lines.join('\n');
}

// Without -s, npm writes its own "> bindery bench" lines to stdout ahead of the JSON.
function readReport(file: string): BenchReport {
  try {
    return JSON.parse(readFileSync(file, 'utf8')) as BenchReport;
  } catch (error) {
    throw new Error(
      `${file} is not the bench's JSON (${(error as Error).message}): write it with npm run -s bench -- --json > ${file}`,
      { cause: error },
    );
  }
}

function main(): void {
  const file = process.argv[2];
  if (!file) throw new Error('Usage: npm run bench:table -- FILE (the output of npm run -s bench -- --json)');
  const report = readReport(file);
  if (!Array.isArray(report.figures) || report.figures.length === 0) throw new Error(`${file} holds no figures`);
  const readme = path.join(projectRoot, 'README.md');
  const text = readFileSync(readme, 'utf8');
  const start = text.indexOf(START);
  const end = text.indexOf(END);
  if (start < 0 || end < start) throw new Error(`README.md has no ${START} ... ${END} section`);
  writeFileSync(readme, `${text.slice(0, start + START.length)}\n${benchTable(report)}\n${text.slice(end)}`);
  console.log(`README.md: the performance table now shows ${report.figures.length} figures from ${file}.`);
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) main();
