import { useSyncExternalStore } from 'react';
import { isOnline, keptModels, savedCopiesSnapshot, subscribeOffline, type KeptModel } from '../lib/offline';

/** Whether the browser says it has a network, updated as the signal comes and goes. */
export function useOnline(): boolean {
  return useSyncExternalStore(subscribeOffline, isOnline, () => true);
}

/** Path -> saved-at of the answers on show that came from this device's copies. */
export function useSavedCopies(): ReadonlyMap<string, string> {
  return useSyncExternalStore(subscribeOffline, savedCopiesSnapshot, savedCopiesSnapshot);
}

export function useKeptModels(): readonly KeptModel[] {
  return useSyncExternalStore(subscribeOffline, keptModels, keptModels);
}

function subscribeController(listener: () => void): () => void {
  navigator.serviceWorker?.addEventListener('controllerchange', listener);
  return () => navigator.serviceWorker?.removeEventListener('controllerchange', listener);
}

/** Whether a service worker saves this page's answers (the built app, in a browser that has them). */
export function useSavesOffline(): boolean {
  return useSyncExternalStore(
    subscribeController,
    () => Boolean(navigator.serviceWorker?.controller),
    () => false,
  );
}
