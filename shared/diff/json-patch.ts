import { format, type Op } from 'jsondiffpatch/formatters/jsonpatch';
import { diffDocuments } from './engine';
import { toPlain } from './plain';

export type JsonPatchOperation = Op;

/**
 * The RFC 6902 JSON Patch that turns `before` into `after`, as stored (no defaults
 * applied: the patch must apply to the stored document). Paths are RFC 6901 JSON
 * Pointers, so list entries are addressed by index, as the RFC requires; the entries
 * are still paired by identity key underneath, so a reordered list becomes `move`
 * operations and an edited entry a `replace` of the changed field only.
 */
export function jsonPatch(before: unknown, after: unknown): JsonPatchOperation[] {
  const { delta } = diffDocuments(toPlain(before, true) ?? null, toPlain(after, true) ?? null);
  return delta === undefined ? [] : (toPlain(format(delta)) as JsonPatchOperation[]);
}
