import { format, type Op } from 'jsondiffpatch/formatters/jsonpatch';
import { diffDocuments } from './engine';
import { decodeKey, fromBare, toBare } from './plain';

export type JsonPatchOperation = Op;

/**
 * The RFC 6902 JSON Patch that turns `before` into `after`, as stored (no defaults
 * applied: the patch must apply to the stored document). Paths are RFC 6901 JSON
 * Pointers, so list entries are addressed by index, as the RFC requires; the entries
 * are still paired by identity key underneath, so a reordered list becomes `move`
 * operations and an edited entry a `replace` of the changed field only.
 */
export function jsonPatch(before: unknown, after: unknown): JsonPatchOperation[] {
  const { delta } = diffDocuments(toBare(before) ?? null, toBare(after) ?? null);
  if (delta === undefined) return [];
  const pointer = (path: string) => path.split('/').map(decodeKey).join('/');
  return format(delta).map((op) => {
    const value = 'value' in op ? { value: fromBare(op.value) ?? null } : {};
    return op.op === 'move'
      ? { ...op, from: pointer(op.from), path: pointer(op.path) }
      : { ...op, path: pointer(op.path), ...value };
  });
}
