// Limits that keep parsing fast and bounded on hostile or accidental input. A real
// setup is a few kilobytes, nests five or six levels deep and uses no aliases at all.
export const MAX_TEXT_BYTES = 512 * 1024;
export const MAX_NESTING_DEPTH = 64;
export const MAX_ALIAS_COUNT = 100;
