import { describe, expect, it } from 'vitest';
import { benchTable, type BenchReport } from '../../scripts/write-bench-table';

// The README's performance table is written from `npm run bench -- --json`, so what it
// says about budgets must follow the figures: an unmet budget is marked, a met one not.
const report: BenchReport = {
  node: 'v20.20.2',
  cpus: 2,
  load_average: [3.21, 2.5, 1],
  figures: [
    {
      name: 'save a revision via the API, 20 concurrent clients',
      unit: 'ms',
      median: 41.234,
      p95: 88.9,
      per_second: 412.4,
      budget: { on: 'p95', below: 30 },
      within: false,
    },
    {
      name: 'check, demo setup',
      unit: 'ms',
      median: 0.61,
      p95: 1.5,
      per_second: null,
      budget: { on: 'median', below: 2 },
      within: true,
    },
    {
      name: "first page's JavaScript, gzipped",
      unit: 'KB',
      median: 121.52,
      p95: null,
      per_second: null,
      budget: { on: 'size', below: 250 },
      within: true,
    },
  ],
  ratios: [{ name: 'save, 1 client / floor, 1 client', on: 'median', ours: 5, theirs: 2, ratio: 2.5 }],
};

describe('the README performance table', () => {
  const table = benchTable(report);
  const rowOf = (name: string) => table.split('\n').find((line) => line.startsWith(`| ${name} |`));

  it('names the machine and its load', () => {
    expect(table).toMatch(/^Node 20\.20\.2, 2 CPUs, load average 3\.2, 2\.5, 1\.0/);
  });

  it('gives each figure its median, p95, rate and budget, marking the unmet one', () => {
    expect(rowOf('save a revision via the API, 20 concurrent clients')).toBe(
      '| save a revision via the API, 20 concurrent clients | 41.2 ms | 88.9 ms | 412 | p95 < 30 ms: **not met** |',
    );
    expect(rowOf('check, demo setup')).toBe('| check, demo setup | 0.61 ms | 1.50 ms |  | median < 2 ms |');
    expect(rowOf("first page's JavaScript, gzipped")).toBe(
      "| first page's JavaScript, gzipped | 122 KB |  |  | < 250 KB |",
    );
  });

  it('lists each ratio to its floor or peer', () => {
    expect(rowOf('save, 1 client / floor, 1 client')).toBe(
      '| save, 1 client / floor, 1 client | median | 5.00 ms | 2.00 ms | 2.50 |',
    );
  });
});
