import { z } from 'zod';
import { pageInput } from './paging';
import { AIRFRAMES, SLUG_PATTERN } from '@shared/format/schema';

// Input shapes shared by the model, revision and upload routes.

import { message, modelName } from '../model-fields';

export { message, modelName };

const revisionNumber = (field: string) =>
  z
    .int({ error: `${field} must be a whole revision number.` })
    .min(1, `${field} is a revision number, 1 or more.`)
    .max(2_147_483_647, `${field} is too large.`);

export const baseField = revisionNumber('base');
export const numberField = revisionNumber('number');

// Form fields arrive as text; a number field must be digits only ("3", not "3.0" or "").
const formNumber = (field: string) =>
  z
    .string({ error: `Send ${field} with the file.` })
    .trim()
    .regex(/^\d{1,10}$/, `${field} must be a whole revision number.`)
    .transform(Number)
    .pipe(revisionNumber(field));

export const yamlField = z.string({ error: 'Send the setup as YAML text in "yaml".' });

export const createModelSchema = z.strictObject({
  name: modelName,
  yaml: yamlField.optional(),
  message: message.optional(),
  airframe: z.enum(AIRFRAMES, { error: `airframe is one of ${AIRFRAMES.join(', ')}.` }).optional(),
});

export const renameModelSchema = z.strictObject({ name: modelName });

export const saveRevisionSchema = z.strictObject({ base: baseField, message: message.optional(), yaml: yamlField });

export const uploadRevisionFields = z.strictObject({ base: formNumber('base'), message: message.optional() });

export const uploadModelFields = z.strictObject({ name: modelName.optional(), message: message.optional() });

export const revertSchema = z.strictObject({ number: numberField, base: baseField, message: message.optional() });

export const forkSchema = z.strictObject({
  number: numberField,
  workspace: z.uuid({ error: 'workspace is the id of a workspace you can edit.' }),
  name: modelName.optional(),
  message: message.optional(),
});

// Like the format's identity slugs, so a tag is also a valid git tag name on export.
export const tagName = z
  .string({ error: 'Give the tag a name.' })
  .trim()
  .regex(
    SLUG_PATTERN,
    'A tag is lower-case letters, digits and dashes (like season-2026 or maiden), at most 40 characters.',
  );

export const tagSchema = z.strictObject({ name: tagName });

export const historyQuery = z.object({
  limit: z.coerce
    .number({ error: 'limit must be a number.' })
    .int('limit must be a whole number.')
    .min(1, 'limit is at least 1.')
    .max(100, 'limit is at most 100.')
    .default(50),
  before: z.coerce
    .number({ error: 'before must be a revision number.' })
    .int('before must be a whole revision number.')
    .min(1, 'before is at least 1.')
    .max(2_147_483_647, 'before is too large.')
    .optional(),
});

export const hangarQuery = pageInput(100).extend({
  archived: z
    .enum(['exclude', 'include', 'only'], { error: 'archived is exclude (the default), include or only.' })
    .default('exclude'),
  q: z
    .string({ error: 'q is the text to search for.' })
    .trim()
    .max(100, 'Search for at most 100 characters.')
    .optional(),
  after: z.uuid({ error: 'after is the id of the last model of the page before.' }).optional(),
});

export const auditQuery = pageInput(50);

export const compareQuery = z.object({
  from: z.string({ error: 'from is the id of a revision.' }),
  to: z.string({ error: 'to is the id of a revision.' }),
});

export const patchQuery = z.object({
  from: z.string({ error: 'from is the id of a revision.' }),
  download: z.string().optional(),
});
