import { beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '@api/models';
import { DEFAULT_CLUB_RULES } from '@shared/rules/club-rules';
import { addMember, createRoleFixture, createUser, type RoleFixture } from './helpers/factories';
import { useMailTestApp } from './helpers/mail';
import { clientFor, createModelVia, edit, SCALE, saveVia, TRAINER, type Client } from './models-support';

// A workspace's club rules: the owners raise checks (or lower warnings and infos, never
// an error), and every revision read in the workspace follows the rules in force now.

const t = useMailTestApp();
let roles: RoleFixture;
let owner: Client;
let editor: Client;
let viewer: Client;
let reviewer: Client;
let secondReviewer: Client;

beforeAll(async () => {
  roles = await createRoleFixture();
  owner = clientFor(t.app, t.config, roles.members.owner);
  editor = clientFor(t.app, t.config, roles.members.editor);
  viewer = clientFor(t.app, t.config, roles.members.viewer);
  reviewer = clientFor(t.app, t.config, roles.members.reviewer);
  const second = await createUser({ name: 'Second Reviewer' });
  await addMember(roles.workspace, second, 'reviewer');
  secondReviewer = clientFor(t.app, t.config, second);
});

// Pin 4 without a failsafe: one failsafe-unset warning (docs/format.md).
const UNSET = () => edit(TRAINER(), '{ pin: 4, ch: 4, failsafe: 1500 }', '{ pin: 4, ch: 4 }');

const rulesUrl = () => `/api/workspaces/${roles.workspace.id}/rules`;
const putRules = (client: Client, body: object) => client.put(rulesUrl(), body);

const rules = (severities: Record<string, string>, approvals: Partial<typeof DEFAULT_CLUB_RULES.approvals> = {}) => ({
  severities,
  approvals: { ...DEFAULT_CLUB_RULES.approvals, ...approvals },
});

async function hangarLatest(name: string) {
  const response = await viewer.get(`/api/workspaces/${roles.workspace.id}/models?q=${encodeURIComponent(name)}`);
  expect(response.status).toBe(200);
  return response.body.data[0].latest as { error_count: number; warning_count: number };
}

describe('GET and PUT /api/workspaces/:ws/rules', () => {
  it('starts at the format’s severities and one approval; every member reads the rules', async () => {
    const response = await viewer.get(rulesUrl()).expect(200);
    expect(response.body.data).toMatchObject({ ...DEFAULT_CLUB_RULES, updated_at: null, history: [] });
    expect(response.body.data.defaults['failsafe-unset']).toBe('warning');
  });

  it('raises a warning to an error: the hangar’s counts, the findings, the field sheet follow; an audit event records it', async () => {
    const { model, revision } = await createModelVia(editor, roles.workspace.id, {
      name: 'Rules trainer',
      yaml: UNSET(),
    });
    expect(await hangarLatest('Rules trainer')).toMatchObject({ error_count: 0, warning_count: 1 });

    const saved = await putRules(owner, rules({ 'failsafe-unset': 'error', 'telemetry-none': 'warning' })).expect(200);
    expect(saved.body.data.severities).toEqual({ 'failsafe-unset': 'error', 'telemetry-none': 'warning' });
    expect(await hangarLatest('Rules trainer')).toMatchObject({ error_count: 1, warning_count: 0 });

    const full = (await viewer.get(`/api/revisions/${revision.id}`).expect(200)).body.data;
    const finding = full.findings.find((f: { rule: string }) => f.rule === 'failsafe-unset');
    expect(finding).toMatchObject({ severity: 'error', club_rule: 'club rule: warning raised to error' });
    const sheet = (await viewer.get(`/api/revisions/${revision.id}/field-sheet`).expect(200)).body.data;
    expect(sheet.counts.errors).toBe(1);
    const model1 = (await viewer.get(`/api/models/${model.id}`).expect(200)).body.data;
    expect(model1.latest.error_count).toBe(1);
    // A save's own answer follows the rules in force too.
    const next = (await saveVia(editor, model.id, 1, edit(UNSET(), 'expo: 30,', 'expo: 31,'))) as unknown as {
      findings: { rule: string; severity: string; club_rule?: string }[];
      error_count: number;
      warning_count: number;
    };
    expect(next).toMatchObject({ error_count: 1, warning_count: 0 });
    expect(next.findings.find((f) => f.rule === 'failsafe-unset')).toMatchObject({
      severity: 'error',
      club_rule: 'club rule: warning raised to error',
    });

    const events = await AuditEvent.findAll({ where: { workspaceId: roles.workspace.id, action: 'rules.changed' } });
    expect(events.at(-1)!.details).toMatchObject({
      before: { severities: {} },
      after: { severities: { 'failsafe-unset': 'error' } },
    });
    const history = (await viewer.get(rulesUrl()).expect(200)).body.data.history;
    expect(history[0]).toMatchObject({
      actor: { id: roles.members.owner.id },
      after: { severities: { 'failsafe-unset': 'error' } },
    });

    // Switched off: the warning is gone from the counts.
    await putRules(owner, rules({ 'failsafe-unset': 'off' })).expect(200);
    expect(await hangarLatest('Rules trainer')).toMatchObject({ error_count: 0, warning_count: 0 });
    await putRules(owner, rules({})).expect(200);
    expect(await hangarLatest('Rules trainer')).toMatchObject({ error_count: 0, warning_count: 1 });
  });

  it('never lowers an error: 422 error-lowered naming the checks, and nothing is stored', async () => {
    await putRules(owner, rules({ 'failsafe-unset': 'error' })).expect(200);
    for (const severity of ['warning', 'info', 'off']) {
      const refused = await putRules(owner, rules({ 'failsafe-throttle': severity, 'telemetry-none': 'error' })).expect(
        422,
      );
      expect(refused.body.error).toMatchObject({ code: 'error-lowered', details: { rules: ['failsafe-throttle'] } });
    }
    expect((await viewer.get(rulesUrl()).expect(200)).body.data.severities).toEqual({ 'failsafe-unset': 'error' });
    await putRules(owner, rules({})).expect(200);
  });

  it('refuses an unknown check, a bad severity or approvals out of range with 400; only owners set rules', async () => {
    await putRules(owner, rules({ 'no-such-check': 'error' })).expect(400);
    await putRules(owner, rules({ 'failsafe-unset': 'fatal' })).expect(400);
    await putRules(owner, rules({}, { default: 4 })).expect(400);
    await putRules(owner, { severities: {} }).expect(400);
    await putRules(editor, rules({ 'failsafe-unset': 'error' })).expect(403);
    const outsider = clientFor(t.app, t.config, roles.outsider);
    await putRules(outsider, rules({})).expect(404);
    await outsider.get(rulesUrl()).expect(404);
  });

  it('asks for more approvals for a heavy model, and lets only the named reviewers approve when the rules say so', async () => {
    // The trainer weighs 2400 g: heavy above 2000 g needs two approvals.
    await putRules(owner, rules({}, { default: 1, heavy_weight_g: 2000, heavy: 2, named_reviewers_only: true })).expect(
      200,
    );
    const { model, revision } = await createModelVia(editor, roles.workspace.id, {
      name: 'Heavy trainer',
      yaml: TRAINER(),
    });
    const asked = await editor
      .post(`/api/revisions/${revision.id}/reviews`, { reviewers: [reviewer.user.id, secondReviewer.user.id] })
      .expect(201);
    const reviewId = asked.body.data.id;
    // The checklist is left unticked here: each approval confirms what it leaves open.
    const refused = await owner.post(`/api/reviews/${reviewId}/verdicts`, { verdict: 'approve' }).expect(403);
    expect(refused.body.error.code).toBe('not-a-named-reviewer');

    await reviewer
      .post(`/api/reviews/${reviewId}/verdicts`, { verdict: 'approve', confirm_left_open: true })
      .expect(201);
    const afterOne = (await viewer.get(`/api/models/${model.id}`).expect(200)).body.data;
    expect(afterOne).toMatchObject({ review_state: 'pending', cleared_for_maiden: false });
    await secondReviewer
      .post(`/api/reviews/${reviewId}/verdicts`, { verdict: 'approve', confirm_left_open: true })
      .expect(201);
    expect((await viewer.get(`/api/models/${model.id}`).expect(200)).body.data).toMatchObject({
      review_state: 'approved',
      cleared_for_maiden: true,
    });

    // Rules in force now: three approvals for heavy models leaves the sign-off short again.
    await putRules(owner, rules({}, { heavy_weight_g: 2000, heavy: 3 })).expect(200);
    expect((await viewer.get(`/api/models/${model.id}`).expect(200)).body.data.cleared_for_maiden).toBe(false);
    await putRules(owner, rules({})).expect(200);
    expect((await viewer.get(`/api/models/${model.id}`).expect(200)).body.data.cleared_for_maiden).toBe(true);
  });

  it('ranks the change findings of a compare by the rules: raised to an error with its note, gone when off', async () => {
    const { model, revision: first } = await createModelVia(editor, roles.workspace.id, {
      name: 'Rules compare',
      yaml: SCALE(),
    });
    // The motor reversed with its fuselage pin still at 1000 µs: one failsafe-meaning-changed
    // warning between the two revisions (docs/format.md, "Checks across two revisions").
    const reversed = await saveVia(
      editor,
      model.id,
      1,
      edit(
        SCALE(),
        'function: motor,         role: throttle,',
        'function: motor,         role: throttle, travel: { reverse: true },',
      ),
      'Reverse the motor channel',
    );
    const compare = async () =>
      (await viewer.get(`/api/compare?from=${first.id}&to=${reversed.id}`).expect(200)).body.data.change_findings;
    expect(await compare()).toMatchObject([{ rule: 'failsafe-meaning-changed', severity: 'warning' }]);
    expect((await compare())[0].club_rule).toBeUndefined();

    await putRules(owner, rules({ 'failsafe-meaning-changed': 'error' })).expect(200);
    expect(await compare()).toMatchObject([
      {
        rule: 'failsafe-meaning-changed',
        severity: 'error',
        club_rule: 'club rule: warning raised to error',
        path: 'receivers[id=fuselage].map[pin=3].failsafe',
      },
    ]);

    await putRules(owner, rules({ 'failsafe-meaning-changed': 'off' })).expect(200);
    expect(await compare()).toEqual([]);
    await putRules(owner, rules({})).expect(200);
    expect(await compare()).toHaveLength(1);
  });
});
