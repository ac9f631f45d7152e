/// <reference types="vite/client" />
/// <reference types="vite-plugin-pwa/vanillajs" />
import { registerSW } from 'virtual:pwa-register';

/**
 * Registers the service worker of the built app. A new version waits until every
 * Bindery tab is closed rather than reloading the page under a pilot's hands; pages
 * are fetched network-first (sw.ts), so online they are the server's current ones.
 */
export function registerServiceWorker(): void {
  if (!import.meta.env.PROD || !('serviceWorker' in navigator)) return;
  registerSW({ immediate: true });
}
