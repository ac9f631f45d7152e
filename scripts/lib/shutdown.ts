// One place that stops what a script started, in reverse order, on Ctrl-C (SIGINT),
// SIGTERM or a fatal error.

type Cleanup = () => Promise<void> | void;

const cleanups: { label: string; run: Cleanup }[] = [];
let stopping: Promise<void> | null = null;

export function onShutdown(label: string, run: Cleanup): void {
  cleanups.push({ label, run });
}

export function shutdown(): Promise<void> {
  stopping ??= (async () => {
    for (const { label, run } of cleanups.reverse()) {
      try {
        await run();
      } catch (error) {
        console.error(`Could not stop ${label}:`, error instanceof Error ? error.message : error);
      }
    }
  })();
  return stopping;
}

const STOP_TIMEOUT_MS = 30_000;

export function exitOnSignals(): void {
  for (const signal of ['SIGINT', 'SIGTERM'] as const) {
    process.on(signal, () => {
      // Ctrl-C reaches this process both from the terminal and relayed by npm's wrappers,
      // so a repeat while stopping is expected and must not cut the stop short.
      if (stopping) return;
      console.log(`\n${signal === 'SIGINT' ? 'Ctrl-C' : signal}: stopping...`);
      setTimeout(() => {
        console.error('Stopping took too long; exiting.');
        process.exit(1);
      }, STOP_TIMEOUT_MS).unref();
      void shutdown().then(() => process.exit(0));
    });
  }
}

/** Prints a failure, stops what was started, exits non-zero. */
export async function fail(error: unknown): Promise<never> {
  console.error(`\n${error instanceof Error ? error.message : String(error)}`);
  await shutdown();
  process.exit(1);
}
