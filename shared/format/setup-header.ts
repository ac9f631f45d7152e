import { FORMAT_ID } from './schema';

// A new model must start from a setup document, not from any YAML that happens to
// parse (a shopping list would otherwise become a model with a screen of errors). The
// `format` line is what says a file is a setup; a setup with other errors is still
// taken, because history keeps everything and the checks say what to fix.

/** What a setup file looks like, for the message that refuses one without its `format` line. */
export const SETUP_FILE_SHAPE = `A setup file is YAML that begins with "format: ${FORMAT_ID}", then model (name, airframe), link (channels), controls, channels, mixes and receivers; docs/format.md has a full example.`;

/** The value of the document's `format` key, when it is the one this version reads. */
export function namesSetupFormat(data: unknown): boolean {
  return (
    data !== null &&
    typeof data === 'object' &&
    !Array.isArray(data) &&
    (data as { format?: unknown }).format === FORMAT_ID
  );
}
