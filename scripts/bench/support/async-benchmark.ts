// Benchmarks that need a database and a running server: they measure a whole load
// run at once (many requests, some of them concurrent) instead of one synchronous
// call, so they are exported as `asyncBenchmarks` beside the runner's `benchmarks`.
// Each module can also be run on its own with tsx, which prints the same row.

export interface AsyncTiming {
  median: number;
  p95: number;
  runs: number;
}

export interface AsyncBenchmark {
  name: string;
  budgetMs: number;
  /** Which figure the budget applies to. */
  budgetOn: 'median' | 'p95';
  measure: () => Promise<AsyncTiming>;
}

function quantile(sorted: readonly number[], q: number): number {
  const index = Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1));
  return sorted[index];
}

export function timingOf(latencies: readonly number[]): AsyncTiming {
  const sorted = [...latencies].sort((a, b) => a - b);
  return { median: quantile(sorted, 0.5), p95: quantile(sorted, 0.95), runs: sorted.length };
}

export async function printAsyncBenchmarks(benchmarks: readonly AsyncBenchmark[]): Promise<void> {
  for (const benchmark of benchmarks) {
    const timing = await benchmark.measure();
    const figure = benchmark.budgetOn === 'p95' ? timing.p95 : timing.median;
    console.log(
      `${benchmark.name}: median ${timing.median.toFixed(3)} ms, p95 ${timing.p95.toFixed(3)} ms over ${timing.runs} requests; ` +
        `budget (${benchmark.budgetOn}) < ${benchmark.budgetMs} ms: ${figure < benchmark.budgetMs ? 'within' : 'OVER'}`,
    );
  }
}
