// Shared by the service worker and the page: the page empties this cache on sign-out and
// sign-in, so one account's saved answers are never shown to another.
export const API_CACHE = 'bindery-api';

/** Set by the service worker on an answer it read from the cache because the network failed. */
export const SAVED_AT_HEADER = 'X-Bindery-Saved-At';
