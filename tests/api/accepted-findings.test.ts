import { beforeAll, describe, expect, it } from 'vitest';
import { createRoleFixture, type RoleFixture } from './helpers/factories';
import { useTestApp } from './helpers/test-app';
import { clientFor, createModelVia, fixture, saveVia, type Client } from './models-support';

// Accepted findings (docs/format.md, accepted[]): a pilot accepts a warning or an info
// with a reason in the setup itself, so the acceptance is versioned, compared and
// reviewed like any other line; an error cannot be accepted.

const t = useTestApp();
let roles: RoleFixture;
let editor: Client;
let viewer: Client;

beforeAll(async () => {
  roles = await createRoleFixture();
  editor = clientFor(t.app, t.config, roles.members.editor);
  viewer = clientFor(t.app, t.config, roles.members.viewer);
});

const ENDSTOP = 'receivers[id=cabin].map[pin=1].failsafe';
const accepting = (text: string, rule: string, path: string, reason: string) =>
  `${text}accepted:\n  - { rule: ${rule}, path: "${path}", reason: ${reason} }\n`;

describe('accepted findings', () => {
  it('an accepted warning stays in the findings with its reason and does not count as open', async () => {
    const open = fixture('invalid/failsafe-endstop.yaml');
    const { model, revision } = await createModelVia(editor, roles.workspace.id, { name: 'Smoke pump', yaml: open });
    expect(revision).toMatchObject({ error_count: 0, warning_count: 1 });
    const saved = await saveVia(
      editor,
      model.id,
      1,
      accepting(open, 'failsafe-endstop', ENDSTOP, 'Pump off at 988 on purpose'),
      'Accept the pump failsafe',
    );
    expect(saved).toMatchObject({ error_count: 0, warning_count: 0, info_count: 0 });
    expect(saved.findings).toEqual([
      expect.objectContaining({ rule: 'failsafe-endstop', path: ENDSTOP, accepted: 'Pump off at 988 on purpose' }),
    ]);
    const shown = (await viewer.get(`/api/models/${model.id}`).expect(200)).body.data;
    expect(shown.latest).toMatchObject({ number: 2, warning_count: 0, error_count: 0 });
  });

  it('an error cannot be accepted: it stays open, and the entry is reported as an error of its own', async () => {
    const text = fixture('invalid/accepted-error.yaml');
    const { revision } = await createModelVia(editor, roles.workspace.id, { name: 'Held throttle', yaml: text });
    const findings = (revision as unknown as { findings: { rule: string; severity: string; accepted?: string }[] })
      .findings;
    expect(revision).toMatchObject({ error_count: 2 });
    const throttle = findings.find((finding) => finding.rule === 'failsafe-throttle')!;
    expect(throttle.severity).toBe('error');
    expect(throttle.accepted).toBeUndefined();
    expect(findings.map((finding) => finding.rule).sort()).toEqual(['accepted-error', 'failsafe-throttle']);
  });

  it('accepting is part of the compare: the new entry is a change a reviewer sees, and the finding leaves the open ones', async () => {
    const open = fixture('invalid/failsafe-endstop.yaml');
    const { model, revision } = await createModelVia(editor, roles.workspace.id, { name: 'Compare it', yaml: open });
    const saved = await saveVia(editor, model.id, 1, accepting(open, 'failsafe-endstop', ENDSTOP, 'Pump off'));
    const body = (await viewer.get(`/api/compare?from=${revision.id}&to=${saved.id}`).expect(200)).body.data;
    expect(body.changes).toHaveLength(1);
    expect(body.changes[0]).toMatchObject({ kind: 'added', section: 'accepted', path: 'accepted' });
    expect(body.changes[0].summary).toContain('Accepted findings');
    expect(body.changes[0].summary).toContain('Pump off');
    expect(body.sections.accepted).toMatchObject({ added: 1 });
    expect(body.findings_delta).toMatchObject({ introduced: [], resolved: [] });
    expect(body.findings_delta.accepted).toEqual([
      expect.objectContaining({ rule: 'failsafe-endstop', accepted: 'Pump off' }),
    ]);
  });
});
