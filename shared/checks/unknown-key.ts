import {
  acceptedSchema,
  activeSchema,
  channelSchema,
  cutSchema,
  linkSchema,
  mixSchema,
  modelSchema,
  pinMapEntrySchema,
  powerSchema,
  proportionalControlSchema,
  ratesSchema,
  receiverSchema,
  setupSchema,
  switchControlSchema,
  travelSchema,
} from '../format/schema';
import { toSemanticPath } from '../parse/semantic-path';
import type { CheckResult, DataCheck } from './check';

interface KeyTree {
  keys: readonly string[];
  /** Known mappings below this one, by key. */
  maps?: Record<string, KeyTree>;
  /** Known lists of mappings below this one, by key. */
  lists?: Record<string, KeyTree>;
}

const keysOf = (...shapes: { shape: object }[]) => [...new Set(shapes.flatMap((s) => Object.keys(s.shape)))];

// The key sets come from the schema itself, so the two cannot drift apart.
const TREE: KeyTree = {
  keys: keysOf(setupSchema),
  maps: {
    model: { keys: keysOf(modelSchema) },
    link: { keys: keysOf(linkSchema) },
    power: { keys: keysOf(powerSchema) },
  },
  lists: {
    controls: { keys: keysOf(switchControlSchema, proportionalControlSchema) },
    channels: {
      keys: keysOf(channelSchema),
      maps: { travel: { keys: keysOf(travelSchema) }, cut: { keys: keysOf(cutSchema) } },
    },
    mixes: {
      keys: keysOf(mixSchema),
      maps: { rates: { keys: keysOf(ratesSchema) }, active: { keys: keysOf(activeSchema) } },
    },
    receivers: {
      keys: keysOf(receiverSchema),
      lists: { map: { keys: keysOf(pinMapEntrySchema) } },
    },
    accepted: { keys: keysOf(acceptedSchema) },
  },
};

function isPlainMap(value: unknown): value is Record<string, unknown> {
  return value !== null && typeof value === 'object' && !Array.isArray(value);
}

function editDistance(a: string, b: string): number {
  const row = Array.from({ length: b.length + 1 }, (_, i) => i);
  for (let i = 1; i <= a.length; i += 1) {
    let diagonal = row[0];
    row[0] = i;
    for (let j = 1; j <= b.length; j += 1) {
      const above = row[j];
      row[j] = Math.min(row[j] + 1, row[j - 1] + 1, diagonal + (a[i - 1] === b[j - 1] ? 0 : 1));
      diagonal = above;
    }
  }
  return row[b.length];
}

function closest(key: string, known: readonly string[]): string | null {
  let best: string | null = null;
  let bestDistance = Math.max(2, Math.floor(key.length / 3)) + 1;
  for (const candidate of known) {
    const distance = editDistance(key.toLowerCase(), candidate);
    if (distance < bestDistance) {
      best = candidate;
      bestDistance = distance;
    }
  }
  return best;
}

export const unknownKey: DataCheck = {
  id: 'unknown-key',
  severity: 'warning',
  description: 'A key this format does not define. It is kept, but nothing reads it.',
  check(doc) {
    const results: CheckResult[] = [];
    const walk = (value: unknown, tree: KeyTree, at: (string | number)[]) => {
      if (!isPlainMap(value)) return;
      for (const key of Object.keys(value)) {
        const here = [...at, key];
        if (!tree.keys.includes(key)) {
          const path = toSemanticPath(doc, here);
          const suggestion = closest(key, tree.keys);
          const where = at.length === 0 ? 'at the top level' : `in ${toSemanticPath(doc, at)}`;
          results.push({
            message: `"${key}" is not a key this format defines ${where}; it is kept, but nothing reads it.`,
            hint: suggestion
              ? `Did you mean "${suggestion}"? Rename it, or remove it if it is not needed.`
              : `Remove it, or keep the information in model.notes. Known keys here: ${tree.keys.join(', ')}.`,
            path,
            at: here,
          });
          continue;
        }
        const child = value[key];
        const map = tree.maps?.[key];
        if (map) walk(child, map, here);
        const list = tree.lists?.[key];
        if (list && Array.isArray(child)) child.forEach((item, i) => walk(item, list, [...here, i]));
      }
    };
    walk(doc, TREE, []);
    return results;
  },
};
