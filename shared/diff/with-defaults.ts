import type { ZodType } from 'zod';
import {
  acceptedSchema,
  channelSchema,
  mixSchema,
  proportionalControlSchema,
  receiverSchema,
  setupSchema,
  switchControlSchema,
  type Setup,
} from '../format/schema';
import { LIST_KEYS } from './identity';
import { isPlainObject, makeBare, setOwn, toBare, type PlainObject } from './plain';

interface ObjectSchema {
  shape: Record<string, ZodType>;
  safeParse: ZodType['safeParse'];
}

// A valid object gets the schema's output. An invalid one keeps its fields as they
// are, except that each field valid on its own takes its parsed form (nested defaults
// included) and each absent field with a default gets the default; so one bad value
// does not make every implicit default of its entry look like a change.
function fillDefaults(schema: ObjectSchema, value: unknown): unknown {
  const whole = schema.safeParse(value);
  if (whole.success) return whole.data;
  if (!isPlainObject(value)) return value;
  const out: PlainObject = { ...value };
  for (const [key, field] of Object.entries(schema.shape)) {
    const present = Object.prototype.hasOwnProperty.call(value, key) && value[key] !== undefined;
    const parsed = field.safeParse(present ? value[key] : undefined);
    if (parsed.success && parsed.data !== undefined) setOwn(out, key, parsed.data);
  }
  return out;
}

function controlSchemaFor(value: unknown): ObjectSchema {
  return isPlainObject(value) && value.kind === 'switch' ? switchControlSchema : proportionalControlSchema;
}

const ENTRY_SCHEMAS: Record<string, (value: unknown) => ObjectSchema> = {
  controls: controlSchemaFor,
  channels: () => channelSchema,
  mixes: () => mixSchema,
  receivers: () => receiverSchema,
  accepted: () => acceptedSchema,
};

// The semantic diff compares what the documents mean, so a default written out
// (`weight: 100`) is no change against one left implicit. Defaults come from the
// format's schema, per entry, whether or not the whole document is valid. A missing
// top-level list counts as empty, which lists every entry of the other side as added
// or removed rather than one opaque change. Takes and gives the engine's form (see
// toBare): keys encoded, so the schema's copying cannot lose a `__proto__` key.
export function withDefaults(data: unknown): PlainObject {
  return withDefaultsAndSetup(data).document;
}

/**
 * withDefaults, and the schema-valid setup its one validation found (null when the
 * document is not valid), so a compare validates each side once for the diff and the
 * bench evaluation together. The document and the setup share their entries (the diff
 * engine's rewriting of the document's lists, which swaps equal entries for the very
 * objects of the other side, leaves the setup's content as it was).
 */
export function withDefaultsAndSetup(data: unknown): { document: PlainObject; setup: Setup | null } {
  if (!isPlainObject(data))
    return {
      document: toBare(Object.fromEntries(Object.keys(LIST_KEYS).map((list) => [list, []]))) as PlainObject,
      setup: null,
    };
  const whole = setupSchema.safeParse(data);
  // `accepted` is the one optional list: absent, it is empty, so a first entry is
  // reported as that entry added. The schema's output is fresh (built from `data`,
  // which is the engine's form), so the document is made of it in place rather than
  // copied: it shares everything below the top level with the setup.
  if (whole.success)
    return {
      document: makeBare({ ...whole.data, accepted: whole.data.accepted ?? [] }) as PlainObject,
      setup: whole.data,
    };
  return { document: fillEntryDefaults(data), setup: null };
}

function fillEntryDefaults(data: PlainObject): PlainObject {
  const copy = fillDefaults(setupSchema, data) as PlainObject;
  for (const [list, schemaFor] of Object.entries(ENTRY_SCHEMAS)) {
    const items = Object.prototype.hasOwnProperty.call(data, list) ? data[list] : undefined;
    if (items === undefined) setOwn(copy, list, []);
    else if (Array.isArray(items))
      setOwn(
        copy,
        list,
        items.map((item) => fillDefaults(schemaFor(item), item)),
      );
  }
  return toBare(copy, true) as PlainObject;
}
