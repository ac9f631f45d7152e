import { auditLine } from '@web/features/team/audit-sentence';
import type { AuditEvent } from '@web/features/team/types';

const WS = 'ws-1';
const PUFFIN = { id: 'm1', name: 'Puffin' };
const event = (
  action: string,
  details: Record<string, unknown>,
  subjectId: string | null = 'subject-1',
  model: AuditEvent['model'] = null,
): AuditEvent => ({
  id: 'e',
  action,
  actor: { id: 'u', name: 'Wren' },
  subject: { type: 'x', id: subjectId },
  model,
  details,
  created_at: '2026-05-01T10:00:00.000Z',
});

describe('audit lines', () => {
  it.each([
    [
      event('member.invited', { email: 'pip@example.org', role: 'owner' }),
      null,
      'invited pip@example.org as an owner',
      null,
    ],
    [
      event('member.role-changed', { name: 'Juno', from: 'viewer', to: 'reviewer' }),
      null,
      'changed the role of Juno from viewer to reviewer',
      null,
    ],
    [event('member.removed', { name: 'Juno', role: 'editor' }), null, 'removed Juno (editor) from the workspace', null],
    [event('member.joined', { role: 'viewer' }), null, 'joined as a viewer', null],
    [
      event(
        'review.requested',
        { number: 4, model_name: 'Puffin', reviewers: [{ name: 'Ines' }, { name: 'Tom' }] },
        'r1',
        PUFFIN,
      ),
      'Puffin',
      'asked Ines and Tom to review revision 4',
      `/w/${WS}/reviews/r1`,
    ],
    [
      event('review.verdict', { verdict: 'request-changes', number: 4, model_name: 'Puffin' }, 'r1'),
      'Puffin',
      'asked for changes to revision 4',
      `/w/${WS}/reviews/r1`,
    ],
    [
      event('revision.saved', { model_id: 'm1', number: 7, errors: 2 }, 'rev-7', PUFFIN),
      'Puffin',
      'saved revision 7 (2 errors)',
      '/models/m1/history',
    ],
    [
      event('revision.saved', { number: 7 }, 'rev-7', { id: 'm2', name: 'Puffin Mk II' }),
      'Puffin Mk II',
      'saved revision 7',
      '/models/m2/history',
    ],
    [
      event('tag.added', { model_id: 'm1', number: 3, name: 'maiden' }, 'tag-1', PUFFIN),
      'Puffin',
      'tagged revision 3 “maiden”',
      '/models/m1/history',
    ],
    [
      event('model.created', { name: 'Puffin' }, 'm1', PUFFIN),
      null,
      'created the model “Puffin”',
      '/models/m1/overview',
    ],
    [event('something.new', {}), null, 'something new', null],
  ])('%#: %o', (input, model, text, to) => {
    const line = auditLine(input, WS);
    expect(line.model).toBe(model);
    expect(line.text).toBe(text);
    expect(line.link?.to ?? null).toBe(to);
  });
});
