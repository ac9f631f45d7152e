import { z } from 'zod';
import { FORMAT_ID, setupSchema } from './schema';

/**
 * The published JSON Schema (draft 2020-12) of the setup format, generated from the
 * zod schema. It describes the document as written (input side: defaults are not
 * required) and, like the zod schema, lets unknown keys through.
 */
export function setupJsonSchema(): Record<string, unknown> {
  const generated = z.toJSONSchema(setupSchema, { target: 'draft-2020-12', io: 'input' }) as Record<string, unknown>;
  const { $schema, ...rest } = generated;
  return {
    $schema,
    title: `Bindery setup document, format ${FORMAT_ID}`,
    description:
      "One RC model's radio setup: controls, channel plan, mixes, receivers and their pin maps with failsafes.",
    ...rest,
  };
}

export const SETUP_SCHEMA_FILE = 'shared/format/setup-1.schema.json';

/** The file's exact text: two-space JSON and a final newline. */
export function setupJsonSchemaText(): string {
  return `${JSON.stringify(setupJsonSchema(), null, 2)}\n`;
}
