import { MAX_TEXT_BYTES } from '@shared/parse/limits';

// What a history import takes, each limit checked while git's output is read (see
// import-history.ts) so a hostile bundle is refused before it costs memory or time.
// The figures are Bindery's own choices: generous for a club's real histories (an
// active model gets a few hundred saves in a season), small enough that one import
// cannot starve the server.

/** The uploaded .bundle file; checked by the upload itself. */
export const MAX_BUNDLE_BYTES = 32 * 1024 * 1024;
/** Commits on the history's first-parent line. */
export const MAX_IMPORT_COMMITS = 10_000;
/** Revisions created, all models together. */
export const MAX_IMPORT_REVISIONS = 10_000;
export const MAX_IMPORT_MODELS = 200;
export const MAX_IMPORT_TAGS = 10_000;
/** One setup file: the same limit as a save's. */
export const MAX_SETUP_BYTES = MAX_TEXT_BYTES;
/** All distinct setup texts together, which the import holds while it checks them. */
export const MAX_IMPORT_TEXT_BYTES = 32 * 1024 * 1024;
/** A revision message, as for a save (api/model-fields.ts). */
export const MAX_MESSAGE_CHARS = 2000;
/**
 * A whole commit object (headers, message, Bindery's trailers, a signature): far more
 * than a 2000-character message needs, so a larger one is refused without reading it.
 */
export const MAX_COMMIT_BYTES = 64 * 1024;
/** Author dates before this are a broken clock or a forgery, not a model's history. */
export const EARLIEST_AUTHOR_DATE = new Date('1990-01-01T00:00:00Z');
/** Author dates may run ahead of the server's clock by this much (time zones, skewed clocks). */
export const FUTURE_AUTHOR_SLACK_MS = 24 * 60 * 60 * 1000;
