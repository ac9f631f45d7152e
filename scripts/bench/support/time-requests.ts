import { requestJson } from './http-client';
import { timingOf, type AsyncTiming } from './async-benchmark';

export interface TimedGet {
  url: string;
  /** Throws when the answer is not the one the benchmark means to time. */
  check: (status: number, body: unknown) => void;
}

/**
 * Sends the requests one at a time (after `warmUp` untimed ones taken from the front of
 * the list) and times each until its whole body is read: what a screen waits for.
 */
export async function timeGets(
  headers: Record<string, string>,
  requests: readonly TimedGet[],
  options: { warmUp?: number; before?: (index: number) => Promise<void> } = {},
): Promise<AsyncTiming> {
  const warmUp = options.warmUp ?? 0;
  const latencies: number[] = [];
  for (let index = 0; index < requests.length; index += 1) {
    await options.before?.(index);
    const { url, check } = requests[index];
    const start = performance.now();
    const { status, body } = await requestJson(url, { headers });
    const elapsed = performance.now() - start;
    check(status, body);
    if (index >= warmUp) latencies.push(elapsed);
  }
  return timingOf(latencies);
}

/** A check that the answer is 200 and passes `test` on its body. */
export function ok(what: string, test: (body: never) => boolean = () => true): TimedGet['check'] {
  return (status, body) => {
    if (status !== 200 || !test(body as never))
      throw new Error(`${what} answered ${status}: ${JSON.stringify(body).slice(0, 300)}`);
  };
}
