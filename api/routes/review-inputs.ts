import { z } from 'zod';
import { CHECKLIST_IDS } from '../reviews/checklist';
import { VERDICTS } from '../models/ReviewVerdict';
import type { BaseChoice } from '../queries/review-views';
import { pageInput } from './paging';

const text = (field: string, max: number) =>
  z
    .string({ error: `${field} is text.` })
    .trim()
    .max(max, `Keep ${field} to ${max} characters.`)
    .regex(/^[^\u0000]*$/, `${field} cannot contain NUL characters.`);

export const requestReviewSchema = z.strictObject({
  reviewers: z
    .array(z.uuid({ error: 'Each reviewer is the id of a member.' }), { error: 'reviewers is a list of member ids.' })
    .min(1, 'Choose at least one reviewer.')
    .max(20, 'Choose at most 20 reviewers.')
    .refine((ids) => new Set(ids).size === ids.length, 'Each reviewer is named once.'),
  note: text('the note', 2000).optional(),
});

const checklistChanges = z
  .record(z.string(), z.boolean({ error: 'Each checklist entry is true (ticked) or false.' }), {
    error: 'checklist maps item ids to true or false.',
  })
  .superRefine((value, context) => {
    for (const key of Object.keys(value)) {
      if (!CHECKLIST_IDS.includes(key))
        context.addIssue({
          code: 'custom',
          path: [key],
          message: `Not a checklist item; the items are ${CHECKLIST_IDS.join(', ')}.`,
        });
    }
  });

export const verdictSchema = z.strictObject({
  verdict: z.enum(VERDICTS, { error: `verdict is one of ${VERDICTS.join(', ')}.` }),
  body: text('the text', 4000).optional(),
  checklist: checklistChanges.optional(),
  confirm_left_open: z.boolean({ error: 'confirm_left_open is true or false.' }).optional(),
});

export const tickSchema = z.strictObject({
  item: z.enum(CHECKLIST_IDS as [string, ...string[]], { error: `item is one of ${CHECKLIST_IDS.join(', ')}.` }),
  ticked: z.boolean({ error: 'ticked is true or false.' }),
});

export const commentSchema = z.strictObject({
  path: z
    .string({ error: 'path is the setting’s semantic path, like receivers[id=wing].map[pin=3].' })
    .trim()
    .min(1, 'Leave path out for a comment on the whole revision.')
    .max(300, 'A path has at most 300 characters.')
    .optional(),
  body: text('the comment', 4000).min(1, 'Write the comment.'),
});

export const replySchema = z.strictObject({ body: text('the reply', 4000).min(1, 'Write the reply.') });

/** Resolve and reopen take nothing but the thread in the address. */
export const emptyBody = z.strictObject({});

export const commentListQuery = pageInput(100).extend({
  status: z.enum(['open', 'resolved', 'all'], { error: 'status is open, resolved or all.' }).default('all'),
});

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** `?base=`: approved, previous, none, or a revision of the model by number or id; absent, the default. */
export const reviewDetailQuery = z.object({
  base: z
    .string({ error: 'base is approved, previous, none, a revision number or a revision id.' })
    .trim()
    .optional()
    .transform((value, context): BaseChoice => {
      if (value === undefined || value === '') return 'default';
      if (value === 'approved' || value === 'previous' || value === 'none') return value;
      if (/^\d{1,9}$/.test(value) && Number(value) >= 1) return { number: Number(value) };
      if (UUID.test(value)) return { id: value.toLowerCase() };
      context.addIssue({
        code: 'custom',
        message: 'base is approved, previous, none, a revision number or a revision id.',
      });
      return z.NEVER;
    }),
});

export const reviewListQuery = pageInput(50).extend({
  status: z.enum(['open', 'closed', 'all'], { error: 'status is open, closed or all.' }).default('all'),
});
