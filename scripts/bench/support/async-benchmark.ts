// Benchmarks that need a database and a running server: they measure a whole load
// run at once (many requests, some of them concurrent) instead of one synchronous
// call, so they are exported as `asyncBenchmarks` beside the runner's `benchmarks`.
// Each module can also be run on its own with tsx, which prints the same row.

import { timingOf, type Timing } from '../benchmark';

export { timingOf };
/** A run may set its own budget where the bar is a figure of the same run (the noise). */
export type AsyncTiming = Timing & { budgetMs?: number };

export interface AsyncBenchmark {
  name: string;
  /** Absent for figures printed to compare, not to judge. */
  budgetMs?: number;
  /** Which figure the budget applies to. */
  budgetOn: 'median' | 'p95';
  measure: () => Promise<AsyncTiming>;
}

export async function printAsyncBenchmarks(benchmarks: readonly AsyncBenchmark[]): Promise<void> {
  for (const benchmark of benchmarks) {
    const timing = await benchmark.measure();
    const budgetMs = timing.budgetMs ?? benchmark.budgetMs;
    const figure = benchmark.budgetOn === 'p95' ? timing.p95 : timing.median;
    const budget =
      budgetMs === undefined
        ? 'no budget'
        : `budget (${benchmark.budgetOn}) < ${budgetMs.toFixed(3)} ms: ${figure < budgetMs ? 'within' : 'OVER'}`;
    console.log(
      `${benchmark.name}: median ${timing.median.toFixed(3)} ms, p95 ${timing.p95.toFixed(3)} ms over ${timing.runs} requests${timing.perSecond === undefined ? '' : ` (${timing.perSecond.toFixed(0)}/s)`}; ${budget}`,
    );
  }
}
