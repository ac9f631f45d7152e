import { API_CACHE, SAVED_AT_HEADER } from '../service-worker/cache-names';

// What the page knows about working without a signal: whether the browser says it is
// online, and which answers on show came from the copies this device saved (the service
// worker marks them with when they were saved). The banner reads both.

type Listener = () => void;
const listeners = new Set<Listener>();
/** Path -> when the copy shown for it was saved (ISO), for answers read from this device since the signal went. */
let savedCopies: ReadonlyMap<string, string> = new Map();

function emit(): void {
  for (const listener of listeners) listener();
}

export function subscribeOffline(listener: Listener): () => void {
  listeners.add(listener);
  window.addEventListener('online', listener);
  window.addEventListener('offline', listener);
  return () => {
    listeners.delete(listener);
    window.removeEventListener('online', listener);
    window.removeEventListener('offline', listener);
  };
}

export const isOnline = (): boolean => navigator.onLine;
export const savedCopiesSnapshot = (): ReadonlyMap<string, string> => savedCopies;

/** Called by the API client for every answer; a fresh one from the server forgets the saved copy of that path. */
export function noteAnswer(path: string, response: Response): void {
  const savedAt = response.headers.get(SAVED_AT_HEADER);
  if (!savedAt && !savedCopies.has(path)) return;
  const next = new Map(savedCopies);
  if (savedAt) next.set(path, savedAt);
  else next.delete(path);
  savedCopies = next;
  emit();
}

if (typeof window !== 'undefined') {
  // Back online: the screens refetch, and the copies on show are the server's again.
  window.addEventListener('online', () => {
    savedCopies = new Map();
    emit();
  });
}

const KEPT_KEY = 'bindery.kept-for-field';
const OWNER_KEY = 'bindery.saved-for';

/**
 * Forgets every API answer saved on this device and the list of models kept for the
 * field: on sign-out, and on sign-in before the new account loads anything, so one
 * account's data is never shown to another.
 */
export async function forgetSavedAnswers(): Promise<void> {
  savedCopies = new Map();
  kept = [];
  localStorage.removeItem(KEPT_KEY);
  localStorage.removeItem(OWNER_KEY);
  emit();
  if (typeof caches !== 'undefined') await caches.delete(API_CACHE);
}

/**
 * Called with each session the server answers: when it names another account than
 * the one whose answers this device saved (or none), those answers are forgotten
 * first. A guard beside sign-out's own clearing, for sessions that ended another way.
 */
export async function claimSavedAnswers(accountId: string | null): Promise<void> {
  const owner = localStorage.getItem(OWNER_KEY);
  if (owner === accountId) return;
  if (owner !== null) await forgetSavedAnswers();
  if (accountId) localStorage.setItem(OWNER_KEY, accountId);
}

export interface KeptModel {
  modelId: string;
  revisionId: string;
  revisionNumber: number;
  savedAt: string;
}

let kept: readonly KeptModel[] | null = null;

/** The models kept for the field on this device (one array until it changes, for useSyncExternalStore). */
export function keptModels(): readonly KeptModel[] {
  if (kept) return kept;
  try {
    const raw = JSON.parse(localStorage.getItem(KEPT_KEY) ?? '[]') as unknown;
    kept = Array.isArray(raw) ? (raw as KeptModel[]) : [];
  } catch {
    kept = [];
  }
  return kept;
}

export function setKeptModel(modelId: string, entry: KeptModel | null): void {
  const others = keptModels().filter((model) => model.modelId !== modelId);
  kept = entry ? [...others, entry] : others;
  localStorage.setItem(KEPT_KEY, JSON.stringify(kept));
  emit();
}
