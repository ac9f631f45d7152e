import { clientsClaim } from 'workbox-core';
import { cleanupOutdatedCaches, matchPrecache, precacheAndRoute, type PrecacheEntry } from 'workbox-precaching';
import { NavigationRoute, registerRoute } from 'workbox-routing';
import { NetworkFirst } from 'workbox-strategies';
import { API, paths } from '../lib/api-paths';
import { API_CACHE, SAVED_AT_HEADER } from './cache-names';

// Bindery's service worker, built by vite-plugin-pwa (injectManifest). The app's own
// files are precached so it opens with no signal; pages and API answers always go to the
// network first, so online the pilot sees what the server says now, and only when the
// network fails is the last answer saved on this device shown, marked with when it was
// saved. Nothing that writes goes through a cache.

declare const self: { __WB_MANIFEST: (PrecacheEntry | string)[]; location: Location };

clientsClaim();
cleanupOutdatedCaches();
precacheAndRoute(self.__WB_MANIFEST);

// Files the server sends, never the app's screens: the field-sheet PDF, YAML downloads,
// exports, and the development outbox.
const NOT_SAVED = [/\.pdf$/, /\/export/, /[?&]download=/];
const NOT_SAVED_PATHS = [paths.outbox(), `${API}/health`];

registerRoute(
  ({ url, request }) =>
    request.method === 'GET' &&
    url.origin === self.location.origin &&
    url.pathname.startsWith(`${API}/`) &&
    !NOT_SAVED_PATHS.some((path) => url.pathname.startsWith(path)) &&
    !NOT_SAVED.some((pattern) => pattern.test(url.pathname + url.search)),
  new NetworkFirst({
    cacheName: API_CACHE,
    plugins: [
      {
        // Only whole, successful answers are worth showing later.
        cacheWillUpdate: ({ response }) => Promise.resolve(response.status === 200 ? response : null),
        cachedResponseWillBeUsed: async ({ cachedResponse }) => {
          if (!cachedResponse) return null;
          const headers = new Headers(cachedResponse.headers);
          const saved = Date.parse(cachedResponse.headers.get('Date') ?? '');
          headers.set(SAVED_AT_HEADER, new Date(Number.isNaN(saved) ? Date.now() : saved).toISOString());
          return new Response(await cachedResponse.blob(), {
            status: cachedResponse.status,
            statusText: cachedResponse.statusText,
            headers,
          });
        },
      },
    ],
  }),
);

// Every screen is the one page: the network's copy while there is one, else the precached one.
registerRoute(
  new NavigationRoute(
    async ({ request }) => {
      try {
        return await fetch(request);
      } catch (error) {
        const shell = await matchPrecache('/index.html');
        if (shell) return shell;
        throw error;
      }
    },
    { denylist: [/^\/api\//] },
  ),
);
