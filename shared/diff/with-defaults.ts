import type { ZodType } from 'zod';
import {
  channelSchema,
  controlSchema,
  mixSchema,
  pinMapEntrySchema,
  receiverSchema,
  setupSchema,
} from '../format/schema';
import { isPlainObject, toPlain, type PlainObject } from './plain';
import { LIST_KEYS } from './identity';

const ENTRY_SCHEMAS: Record<string, ZodType> = {
  controls: controlSchema,
  channels: channelSchema,
  mixes: mixSchema,
  receivers: receiverSchema,
};

function parsedOr(schema: ZodType, value: unknown): unknown {
  const result = schema.safeParse(value);
  return result.success ? result.data : value;
}

// The semantic diff compares what the documents mean, so a default written out
// (`weight: 100`) is no change against one left implicit. The whole document gets
// the schema's defaults when it is valid; otherwise each list entry that is valid on
// its own gets them, so that one bad field elsewhere does not make every implicit
// default show up as a change. Missing top-level lists count as empty, which lists
// every entry of the other side as added or removed rather than one opaque change.
export function withDefaults(data: unknown): PlainObject {
  if (!isPlainObject(data)) return Object.fromEntries(Object.keys(LIST_KEYS).map((list) => [list, []]));
  const whole = setupSchema.safeParse(data);
  if (whole.success) return toPlain(whole.data) as PlainObject;
  const copy: PlainObject = { ...data };
  for (const [list, schema] of Object.entries(ENTRY_SCHEMAS)) {
    const items = copy[list];
    if (items === undefined) {
      copy[list] = [];
      continue;
    }
    if (!Array.isArray(items)) continue;
    copy[list] = items.map((item) => {
      const parsed = parsedOr(schema, item);
      if (list !== 'receivers' || parsed !== item || !isPlainObject(item) || !Array.isArray(item.map)) return parsed;
      return { ...item, map: item.map.map((pin) => parsedOr(pinMapEntrySchema, pin)) };
    });
  }
  return toPlain(copy) as PlainObject;
}
