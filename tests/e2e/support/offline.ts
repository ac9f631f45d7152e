import type { Page } from 'playwright-core';

/** Waits until Bindery's service worker controls the page, so what the page fetches from now on is saved. */
export async function waitForServiceWorker(page: Page): Promise<void> {
  await page.waitForFunction(() => navigator.serviceWorker?.controller !== null, undefined, { timeout: 30_000 });
}

/** The API addresses saved in the page's CacheStorage, with the text of each answer. */
export function savedApiAnswers(page: Page): Promise<{ url: string; body: string }[]> {
  return page.evaluate(async () => {
    const out: { url: string; body: string }[] = [];
    for (const name of await caches.keys()) {
      const cache = await caches.open(name);
      for (const request of await cache.keys()) {
        if (!new URL(request.url).pathname.startsWith('/api/')) continue;
        const response = await cache.match(request);
        out.push({ url: request.url, body: response ? await response.text() : '' });
      }
    }
    return out;
  });
}
