import type { ReadCheck } from './check';

// Findings come from shared/parse/parse-yaml.ts, which reads the text.
export const syntax: ReadCheck = {
  id: 'syntax',
  severity: 'error',
  description:
    'The text is not valid YAML (duplicate keys included), is too large or too deeply nested to read, or its root is not a mapping.',
};
