import { auditLine } from '../../../web/features/team/audit-sentence';
import type { AuditEvent } from '../../../web/features/team/types';

const WS = 'ws-1';
const event = (action: string, details: Record<string, unknown>, subjectId: string | null = 'subject-1'): AuditEvent => ({
  id: 'e',
  action,
  actor: { id: 'u', name: 'Wren' },
  subject: { type: 'x', id: subjectId },
  details,
  created_at: '2026-05-01T10:00:00.000Z',
});

describe('audit lines', () => {
  it.each([
    [event('member.invited', { email: 'pip@example.org', role: 'owner' }), 'invited pip@example.org as an owner', null],
    [event('member.role-changed', { name: 'Juno', from: 'viewer', to: 'reviewer' }), 'changed the role of Juno from viewer to reviewer', null],
    [event('member.removed', { name: 'Juno', role: 'editor' }), 'removed Juno (editor) from the workspace', null],
    [event('member.joined', { role: 'viewer' }), 'joined as a viewer', null],
    [event('review.requested', { number: 4, model_name: 'Puffin', reviewers: [{ name: 'Ines' }, { name: 'Tom' }] }, 'r1'), 'asked Ines and Tom to review revision 4 of “Puffin”', `/w/${WS}/reviews/r1`],
    [event('review.verdict', { verdict: 'request-changes', number: 4, model_name: 'Puffin' }, 'r1'), 'asked for changes to revision 4 of “Puffin”', `/w/${WS}/reviews/r1`],
    [event('revision.saved', { model_id: 'm1', number: 7, errors: 2 }), 'saved revision 7 (2 errors)', '/models/m1/history'],
    [event('model.created', { name: 'Puffin' }, 'm1'), 'created the model “Puffin”', '/models/m1/overview'],
    [event('something.new', {}), 'something new', null],
  ])('%#: %o', (input, text, to) => {
    const line = auditLine(input, WS);
    expect(line.text).toBe(text);
    expect(line.link?.to ?? null).toBe(to);
  });
});
