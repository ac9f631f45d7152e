import type { Frame, Page } from 'playwright-core';

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

const OFFLINE = { offline: true, latency: 0, downloadThroughput: -1, uploadThroughput: -1 };

/**
 * Takes the page's network away until `online` is called, as a phone at the field
 * loses its signal. Playwright's setOffline cuts the network, but with the Chromium
 * Debian ships (150) a document the page navigates to, or reloads into, reads
 * `navigator.onLine` as true again and gets no `offline` event; so the emulation is
 * sent again to each new document (which then fires `offline`, as a real device does).
 */
export async function goOffline(page: Page): Promise<{ online(): Promise<void> }> {
  const context = page.context();
  await context.setOffline(true);
  const cdp = await context.newCDPSession(page);
  const again = (frame: Frame) => {
    if (frame === page.mainFrame()) void cdp.send('Network.emulateNetworkConditions', OFFLINE).catch(() => {});
  };
  page.on('framenavigated', again);
  return {
    async online() {
      page.off('framenavigated', again);
      await cdp.send('Network.emulateNetworkConditions', { ...OFFLINE, offline: false });
      await cdp.detach();
      await context.setOffline(false);
    },
  };
}
