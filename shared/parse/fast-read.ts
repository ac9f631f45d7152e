import { CORE_SCHEMA, load } from 'js-yaml';
import { MAX_NESTING_DEPTH } from './limits';

// js-yaml reads a plain setup about fifteen times faster than the `yaml` package, but
// it keeps no source positions and differs from the `yaml` package (the reference) at a
// few edges. Those edges are refused here so the caller falls back to the reference:
// anchors, aliases, tags and merge keys (`&`, `*`, `!`, `<<`, anywhere, comments
// included), directives such as `%YAML 1.1` (which switch the reference to YAML 1.1
// scalars).
const NOT_PLAIN = /[&*!]|<<|^%/m;

// Numbers too large for a double: the reference reads them as ±Infinity, js-yaml keeps
// the text. A string that looks like a YAML 1.2 core number therefore falls back, which
// also covers quoted numbers (rare, and a schema error in a setup anyway).
const CORE_NUMBER = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?$|^0x[0-9a-fA-F]+$|^0o[0-7]+$/;

// The reference turns a null key (`~:`, `null:`, `: x`) into "", js-yaml into "null".
const NULL_KEY = 'null';

function plainEnough(value: unknown): boolean {
  if (typeof value === 'string') return !CORE_NUMBER.test(value);
  if (value === null || typeof value !== 'object') return true;
  if (Array.isArray(value)) return value.every(plainEnough);
  if (Object.getPrototypeOf(value) !== Object.prototype) return false;
  for (const key of Object.keys(value)) {
    if (key === NULL_KEY || CORE_NUMBER.test(key)) return false;
    if (!plainEnough((value as Record<string, unknown>)[key])) return false;
  }
  return true;
}

/**
 * The plain data of setup text read by js-yaml (YAML 1.2 core schema, duplicate keys
 * refused), or null whenever the text is outside what it is proven to read exactly as
 * `parseYaml` does: then the caller must use `parseYaml`. The size limit is the
 * caller's to check first.
 */
export function readSetupFast(text: string): Record<string, unknown> | null {
  if (NOT_PLAIN.test(text)) return null;
  let data: unknown;
  try {
    data = load(text, { schema: CORE_SCHEMA, maxDepth: MAX_NESTING_DEPTH, maxAliases: 0 });
  } catch {
    return null;
  }
  if (data === null || typeof data !== 'object' || Array.isArray(data)) return null;
  return plainEnough(data) ? (data as Record<string, unknown>) : null;
}
