// The shape of a benchmark module: any file in scripts/bench/ that exports
// `benchmarks` is run by index.ts. Timing helpers live here too.

export interface Benchmark {
  name: string;
  /** Budget for the median, in milliseconds, printed beside the result. */
  budgetMs?: number;
  /** One run of the work being measured. */
  run: () => unknown;
  /** Timed runs; the runner warms up with a fifth as many first. Default 200. */
  iterations?: number;
}

export interface Timing {
  median: number;
  p95: number;
  runs: number;
  /** Operations completed per second over the whole run, for load runs. */
  perSecond?: number;
}

function quantile(sorted: readonly number[], q: number): number {
  const index = Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1));
  return sorted[index];
}

/** Median and p95 of a set of samples in milliseconds. */
export function timingOf(samples: readonly number[]): Timing {
  const sorted = [...samples].sort((a, b) => a - b);
  return { median: quantile(sorted, 0.5), p95: quantile(sorted, 0.95), runs: sorted.length };
}

export function measure(benchmark: Benchmark): Timing {
  const runs = benchmark.iterations ?? 200;
  let sink: unknown;
  for (let i = 0; i < Math.max(10, Math.floor(runs / 5)); i += 1) sink = benchmark.run();
  const times: number[] = [];
  for (let i = 0; i < runs; i += 1) {
    const start = performance.now();
    sink = benchmark.run();
    times.push(performance.now() - start);
  }
  // Keeps the result alive so the work cannot be optimised away.
  if (sink === Symbol.for('never')) console.log(sink);
  return timingOf(times);
}

/** A size budget rather than a time: measured once, in kilobytes. */
export interface SizeCheck {
  name: string;
  budgetKb: number;
  measure: () => Promise<number>;
}
