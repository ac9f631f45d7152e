import { setupSchema, type Setup } from '../format/schema';
import { sha256Hex } from './sha256-hex';

function isPlainObject(value: unknown): value is Record<string, unknown> {
  return value !== null && typeof value === 'object' && !Array.isArray(value);
}

/** JSON with every mapping's keys sorted, lists in order, and JSON's own rules for the rest. */
function sortedJson(value: unknown): string {
  if (Array.isArray(value)) {
    return `[${value.map((item) => (item === undefined ? 'null' : sortedJson(item))).join(',')}]`;
  }
  if (isPlainObject(value)) {
    const parts: string[] = [];
    for (const key of Object.keys(value).sort()) {
      const item = value[key];
      if (item === undefined) continue;
      parts.push(`${JSON.stringify(key)}:${sortedJson(item)}`);
    }
    return `{${parts.join(',')}}`;
  }
  return JSON.stringify(value) ?? 'null';
}

/**
 * The canonical JSON of a setup's data: keys sorted at every level, lists kept in
 * their order, and, when the data is a valid setup, the format's defaults filled in,
 * so that writing a default out or leaving it implicit means the same. Comments,
 * formatting and key order of the YAML do not count.
 */
export function canonicalJson(data: unknown): string {
  const parsed = setupSchema.safeParse(data);
  return sortedJson(parsed.success ? parsed.data : data);
}

/** Lowercase hex SHA-256 of the canonical JSON: the revision's content hash. */
export function contentHash(data: unknown): string {
  return sha256Hex(canonicalJson(data));
}

/**
 * The canonical JSON of data the checks have already validated: `setup` is what the
 * format's schema made of `data` (null when it is not a valid setup), so the schema is
 * not run a second time. Equal to `canonicalJson(data)`; the API's save hashes it with
 * the platform's own SHA-256, about ten times faster than the portable one here.
 */
export function canonicalJsonOfChecked(data: unknown, setup: Setup | null): string {
  return sortedJson(setup ?? data);
}
