import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { SETUP_SCHEMA_FILE, setupJsonSchemaText } from '@shared/format/json-schema';

// Regenerates the committed JSON Schema from the zod schema (npm run schema:write).
const target = fileURLToPath(new URL(`../${SETUP_SCHEMA_FILE}`, import.meta.url));
writeFileSync(target, setupJsonSchemaText());
console.log(`wrote ${SETUP_SCHEMA_FILE}`);
