import { randomUUID } from 'node:crypto';
import { parse } from 'yaml';
import { beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent, Receiver } from '@api/models';
import type { Role } from '@shared/contract/roles';
import { createRoleFixture, type RoleFixture } from './helpers/factories';
import { useTestApp } from './helpers/test-app';
import { clientFor, createModelVia, fixture, SCALE, type Client } from './models-support';

const t = useTestApp();
let roles: RoleFixture;
let as: Record<Role | 'outsider', Client>;
let scale: { id: string; revisionId: string };

const unitFixture = (name: string) => parse(fixture(`reuse/${name}.yaml`)) as Record<string, unknown>;
const shelf = () => `/api/workspaces/${roles.workspace.id}/receivers`;

async function addUnit(body: Record<string, unknown>) {
  const response = await as.editor.post(shelf(), body);
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  return response.body.data as { id: string; [key: string]: unknown };
}

beforeAll(async () => {
  roles = await createRoleFixture();
  as = {
    owner: clientFor(t.app, t.config, roles.members.owner),
    editor: clientFor(t.app, t.config, roles.members.editor),
    reviewer: clientFor(t.app, t.config, roles.members.reviewer),
    viewer: clientFor(t.app, t.config, roles.members.viewer),
    outsider: clientFor(t.app, t.config, roles.outsider),
  };
  const created = await createModelVia(as.editor, roles.workspace.id, { name: 'Kestrel Mk II', yaml: SCALE() });
  scale = { id: created.model.id, revisionId: created.revision.id };
});

describe('POST /api/workspaces/:ws/receivers', () => {
  it('puts a unit on the shelf, free, with its stored settings, and audits it', async () => {
    const unit = await addUnit({ ...unitFixture('trainer-unit'), notes: 'Bought at the swap meet' });
    expect(unit).toMatchObject({
      workspace_id: roles.workspace.id,
      label: 'Pipit trainer unit',
      mark: 'Yellow dot',
      mark_colour: 'yellow',
      outputs: 8,
      notes: 'Bought at the swap meet',
      telemetry: true,
      status: 'free',
      installed: null,
      readiness: null,
    });
    expect((unit.stored_settings as { pins: unknown[] }).pins).toHaveLength(8);
    expect(unit.settings_recorded_at).toEqual(expect.any(String));
    const events = await AuditEvent.findAll({ where: { subjectId: unit.id } });
    expect(events.map((event) => [event.action, event.subjectType, event.actorId])).toEqual([
      ['receiver.added', 'receiver', roles.members.editor.id],
    ]);
  });

  it('takes a unit whose settings are not known yet', async () => {
    const unit = await addUnit({ label: 'Spare 6-output', outputs: 6 });
    expect(unit).toMatchObject({
      stored_settings: null,
      telemetry: null,
      mark: null,
      mark_colour: null,
      notes: '',
      settings_recorded_at: null,
    });
  });

  it.each([
    ['no label', { outputs: 8 }, 'label'],
    ['a blank label', { label: '   ', outputs: 8 }, 'label'],
    ['no outputs', { label: 'X' }, 'outputs'],
    ['too many outputs', { label: 'X', outputs: 33 }, 'outputs'],
    ['an unknown colour', { label: 'X', outputs: 8, mark_colour: 'teal' }, 'mark_colour'],
    ['an unknown field', { label: 'X', outputs: 8, colour: 'red' }, 'colour'],
    [
      'a pin above the outputs',
      { label: 'X', outputs: 4, stored_settings: { telemetry: true, pins: [{ pin: 5, ch: 5 }] } },
      'stored_settings.pins.0.pin',
    ],
    [
      'a pin listed twice',
      {
        label: 'X',
        outputs: 8,
        stored_settings: {
          telemetry: true,
          pins: [
            { pin: 1, ch: 1 },
            { pin: 1, ch: 2 },
          ],
        },
      },
      'stored_settings.pins.1.pin',
    ],
    [
      'a failsafe out of range',
      { label: 'X', outputs: 8, stored_settings: { telemetry: true, pins: [{ pin: 1, ch: 1, failsafe: 3000 }] } },
      'stored_settings.pins.0.failsafe',
    ],
    ['telemetry missing', { label: 'X', outputs: 8, stored_settings: { pins: [] } }, 'stored_settings.telemetry'],
  ])('refuses %s with 400, naming the field, and stores nothing', async (_name, body, field) => {
    const before = await Receiver.count();
    const response = await as.editor.post(shelf(), body).expect(400);
    expect(response.body.error.code).toBe('invalid-input');
    expect(Object.keys(response.body.error.details.fields)).toContain(field);
    expect(await Receiver.count()).toBe(before);
  });
});

describe('the shelf’s role rules', () => {
  let unitId: string;
  beforeAll(async () => {
    unitId = (await addUnit({ label: 'Role check unit', outputs: 8 })).id;
  });

  const readers: Role[] = ['viewer', 'reviewer', 'editor', 'owner'];
  it.each(readers)('%s reads the shelf, a unit, its history and a reuse check', async (role) => {
    await as[role].get(shelf()).expect(200);
    await as[role].get(`/api/receivers/${unitId}`).expect(200);
    await as[role].get(`/api/receivers/${unitId}/history`).expect(200);
    await as[role].get(`/api/receivers/${unitId}/reuse-check?model=${scale.id}&slot=wing`).expect(200);
  });

  it.each(['viewer', 'reviewer'] as Role[])(
    '%s may not add, change, install, remove or apply: 403 role-too-low',
    async (role) => {
      const calls = [
        as[role].post(shelf(), { label: 'Nope', outputs: 8 }),
        as[role].patch(`/api/receivers/${unitId}`, { label: 'Nope' }),
        as[role].post(`/api/receivers/${unitId}/install`, { model: scale.id, slot: 'wing' }),
        as[role].post(`/api/receivers/${unitId}/remove`),
        as[role].post(`/api/receivers/${unitId}/apply`),
      ];
      for (const response of await Promise.all(calls)) {
        expect(response.status).toBe(403);
        expect(response.body.error).toMatchObject({ code: 'role-too-low', details: { required: 'editor', role } });
      }
      expect((await Receiver.findByPk(unitId))!.label).toBe('Role check unit');
    },
  );

  it('an owner may change a unit', async () => {
    const response = await as.owner.patch(`/api/receivers/${unitId}`, { notes: 'Checked by the owner' }).expect(200);
    expect(response.body.data.notes).toBe('Checked by the owner');
  });

  it('another workspace’s receiver is 404 to an outsider, every route alike, as is one that does not exist', async () => {
    for (const id of [unitId, randomUUID(), 'not-an-id']) {
      const responses = await Promise.all([
        as.outsider.get(`/api/receivers/${id}`),
        as.outsider.patch(`/api/receivers/${id}`, { label: 'Mine now' }),
        as.outsider.get(`/api/receivers/${id}/history`),
        as.outsider.get(`/api/receivers/${id}/reuse-check?model=${scale.id}&slot=wing`),
        as.outsider.post(`/api/receivers/${id}/install`, { model: scale.id, slot: 'wing' }),
        as.outsider.post(`/api/receivers/${id}/remove`),
        as.outsider.post(`/api/receivers/${id}/apply`),
      ]);
      for (const response of responses) {
        expect(response.status).toBe(404);
        expect(response.body.error.code).toBe('receiver-not-found');
      }
    }
    await as.outsider.get(shelf()).expect(404);
    await as.outsider.post(shelf(), { label: 'Sneaky', outputs: 8 }).expect(404);
  });

  it('needs a session', async () => {
    const { default: request } = await import('supertest');
    await request(t.app).get(shelf()).expect(401);
    await request(t.app).get(`/api/receivers/${unitId}`).expect(401);
  });
});

describe('GET /api/workspaces/:ws/receivers', () => {
  let ws: string;
  let client: Client;
  beforeAll(async () => {
    const own = await createRoleFixture();
    ws = own.workspace.id;
    client = clientFor(t.app, t.config, own.members.editor);
    const model = await createModelVia(client, ws, { name: 'Search model', yaml: SCALE() });
    const add = async (body: Record<string, unknown>) =>
      (await client.post(`/api/workspaces/${ws}/receivers`, body).expect(201)).body.data.id as string;
    await add({ label: 'Bravo fuselage', mark: 'Blue tape', mark_colour: 'blue', outputs: 8 });
    const wing = await add({ label: 'alpha wing', mark: 'Red tape', mark_colour: 'red', outputs: 8 });
    await add({ label: 'Charlie spare', outputs: 6, notes: 'Has a 100% new case' });
    await client.post(`/api/receivers/${wing}/install`, { model: model.model.id, slot: 'wing' }).expect(201);
  });

  const labels = async (query: string) => {
    const response = await client.get(`/api/workspaces/${ws}/receivers${query}`).expect(200);
    return {
      labels: response.body.data.map((unit: { label: string }) => unit.label),
      pagination: response.body.pagination,
    };
  };

  it('lists the units by label, case aside, paginated', async () => {
    expect(await labels('')).toEqual({
      labels: ['alpha wing', 'Bravo fuselage', 'Charlie spare'],
      pagination: { limit: 100, offset: 0, total: 3, next_after: null },
    });
    expect(await labels('?limit=1&offset=1')).toEqual({
      labels: ['Bravo fuselage'],
      pagination: { limit: 1, offset: 1, total: 3, next_after: expect.any(String) },
    });
  });

  it('searches label, mark and notes, taking % and _ literally', async () => {
    expect((await labels('?q=TAPE')).labels).toEqual(['alpha wing', 'Bravo fuselage']);
    expect((await labels('?q=spare')).labels).toEqual(['Charlie spare']);
    expect((await labels('?q=100%25')).labels).toEqual(['Charlie spare']);
    expect((await labels('?q=%25')).labels).toEqual(['Charlie spare']);
    expect((await labels('?q=_')).labels).toEqual([]);
  });

  it('filters installed and free units, and the count agrees', async () => {
    expect(await labels('?status=installed')).toMatchObject({ labels: ['alpha wing'], pagination: { total: 1 } });
    expect(await labels('?status=free')).toMatchObject({
      labels: ['Bravo fuselage', 'Charlie spare'],
      pagination: { total: 2 },
    });
    expect(await labels('?status=free&q=bravo')).toMatchObject({
      labels: ['Bravo fuselage'],
      pagination: { total: 1 },
    });
  });

  it('shows where an installed unit is and whether it is ready for that slot', async () => {
    const [wing] = (await client.get(`/api/workspaces/${ws}/receivers?status=installed`).expect(200)).body.data;
    expect(wing).toMatchObject({
      status: 'installed',
      installed: { model: { name: 'Search model' }, slot: 'wing' },
      // Never recorded: every setting of the slot is a change.
      readiness: { state: 'changes', changes: 17, revision: { number: 1 }, reason: null },
    });
  });

  it('refuses a bad filter with 400', async () => {
    const response = await client.get(`/api/workspaces/${ws}/receivers?status=lost`).expect(400);
    expect(response.body.error.details.fields.status).toBe('status is installed or free.');
    await client.get(`/api/workspaces/${ws}/receivers?limit=0`).expect(400);
  });
});

describe('PATCH /api/receivers/:id', () => {
  it('changes the record, audits before and after, and leaves unsent fields alone', async () => {
    const unit = await addUnit({ label: 'Patch me', mark: 'Dot', outputs: 8 });
    const response = await as.editor
      .patch(`/api/receivers/${unit.id}`, { label: 'Patched', mark: '', mark_colour: 'pink' })
      .expect(200);
    expect(response.body.data).toMatchObject({ label: 'Patched', mark: null, mark_colour: 'pink', outputs: 8 });
    const [event] = await AuditEvent.findAll({ where: { subjectId: unit.id, action: 'receiver.updated' } });
    expect(event.details).toEqual({
      before: { label: 'Patch me', mark: 'Dot', mark_colour: null },
      after: { label: 'Patched', mark: null, mark_colour: 'pink' },
    });
  });

  it('records settings read off the unit', async () => {
    const unit = await addUnit({ label: 'Read off', outputs: 4 });
    const stored = {
      telemetry: false,
      pins: [
        { pin: 2, ch: 6, failsafe: 'hold' },
        { pin: 1, ch: 5 },
      ],
    };
    const response = await as.editor.patch(`/api/receivers/${unit.id}`, { stored_settings: stored }).expect(200);
    expect(response.body.data.stored_settings).toEqual({
      telemetry: false,
      pins: [
        { pin: 1, ch: 5, failsafe: null },
        { pin: 2, ch: 6, failsafe: 'hold' },
      ],
    });
    expect(response.body.data.telemetry).toBe(false);
  });

  it('refuses fewer outputs than the stored settings use, with 422, and stores nothing', async () => {
    const unit = await addUnit({
      label: 'Shrink',
      outputs: 8,
      stored_settings: { telemetry: true, pins: [{ pin: 7, ch: 7 }] },
    });
    const response = await as.editor.patch(`/api/receivers/${unit.id}`, { outputs: 6 }).expect(422);
    expect(response.body.error).toMatchObject({ code: 'pins-beyond-outputs', details: { pins: [7] } });
    expect((await Receiver.findByPk(unit.id))!.outputs).toBe(8);
  });

  it('refuses an empty change and unknown fields with 400', async () => {
    const unit = await addUnit({ label: 'Empty', outputs: 8 });
    await as.editor.patch(`/api/receivers/${unit.id}`, {}).expect(400);
    await as.editor.patch(`/api/receivers/${unit.id}`, { workspace_id: randomUUID() }).expect(400);
  });
});

describe('GET /api/receivers/:id/reuse-check', () => {
  it('answers the contract’s shape against the model’s latest revision', async () => {
    const unit = await addUnit(unitFixture('trainer-unit'));
    const response = await as.viewer
      .get(`/api/receivers/${unit.id}/reuse-check?model=${scale.id}&slot=wing`)
      .expect(200);
    const { data } = response.body;
    expect(data.ready).toBe(false);
    for (const change of data.changes) {
      expect(Object.keys(change).sort()).toEqual(['from', 'pin', 'safety', 'setting', 'summary', 'to']);
      expect(['ch', 'failsafe', 'telemetry']).toContain(change.setting);
      expect(change.pin === null).toBe(change.setting === 'telemetry');
    }
    expect(data.changes).toContainEqual({
      pin: 3,
      setting: 'ch',
      from: 3,
      to: 11,
      summary: 'Pin 3: carries channel 3, must carry channel 11',
      safety: null,
    });
    expect(data.changes).toContainEqual({
      pin: 3,
      setting: 'failsafe',
      from: 988,
      to: 'hold',
      summary: 'Pin 3: failsafe 988 µs, set hold',
      safety: expect.stringContaining('A failsafe left from the last airframe (988 µs)'),
    });
    expect(data.changes).toContainEqual({
      pin: null,
      setting: 'telemetry',
      from: true,
      to: false,
      summary: 'Telemetry: on, switch it off',
      safety: expect.stringContaining('Two receivers sending telemetry'),
    });
    expect(data).toMatchObject({
      receiver_id: unit.id,
      model: { id: scale.id, name: 'Kestrel Mk II' },
      revision: { id: scale.revisionId, number: 1 },
      slot: { id: 'wing', role: 'secondary', outputs: 8, telemetry: false },
      notes: [],
      findings: [],
      installed_here: false,
      holder: null,
    });
  });

  it('names the unit that holds the slot now', async () => {
    const holder = await addUnit(unitFixture('wing-unit'));
    const model = await createModelVia(as.editor, roles.workspace.id, { name: 'Held slot', yaml: SCALE() });
    await as.editor.post(`/api/receivers/${holder.id}/install`, { model: model.model.id, slot: 'wing' }).expect(201);
    const asker = await addUnit(unitFixture('trainer-unit'));
    const { data } = (
      await as.viewer.get(`/api/receivers/${asker.id}/reuse-check?model=${model.model.id}&slot=wing`).expect(200)
    ).body;
    expect(data.holder).toEqual({ id: holder.id, label: 'Kestrel wing unit' });
    const own = (
      await as.viewer.get(`/api/receivers/${holder.id}/reuse-check?model=${model.model.id}&slot=wing`).expect(200)
    ).body.data;
    expect(own).toMatchObject({ installed_here: true, holder: { id: holder.id }, ready: true });
  });

  it('is ready with no changes for a unit that matches', async () => {
    const unit = await addUnit(unitFixture('wing-unit'));
    const { data } = (
      await as.viewer.get(`/api/receivers/${unit.id}/reuse-check?model=${scale.id}&slot=wing`).expect(200)
    ).body;
    expect(data).toMatchObject({ changes: [], ready: true });
  });

  it('reports an output-count mismatch', async () => {
    const unit = await addUnit(unitFixture('six-output-unit'));
    const { data } = (
      await as.viewer.get(`/api/receivers/${unit.id}/reuse-check?model=${scale.id}&slot=wing`).expect(200)
    ).body;
    expect(data.ready).toBe(false);
    expect(data.notes[0]).toMatchObject({ kind: 'outputs-short', blocking: true });
  });

  it('says which slots exist when the slot is not in the setup (422), and needs model and slot (400)', async () => {
    const unit = await addUnit({ label: 'Asker', outputs: 8 });
    const missing = await as.viewer
      .get(`/api/receivers/${unit.id}/reuse-check?model=${scale.id}&slot=tail`)
      .expect(422);
    expect(missing.body.error).toMatchObject({
      code: 'slot-not-found',
      details: { slot: 'tail', slots: ['fuselage', 'wing'] },
    });
    await as.viewer.get(`/api/receivers/${unit.id}/reuse-check?slot=wing`).expect(400);
    await as.viewer.get(`/api/receivers/${unit.id}/reuse-check?model=${scale.id}&slot=Not%20A%20Slot`).expect(400);
  });

  it('does not reach into a model of another workspace (404)', async () => {
    const unit = await addUnit({ label: 'Stay home', outputs: 8 });
    const elsewhere = await createModelVia(as.outsider, roles.otherWorkspace.id, { name: 'Not yours', yaml: SCALE() });
    const response = await as.editor
      .get(`/api/receivers/${unit.id}/reuse-check?model=${elsewhere.model.id}&slot=wing`)
      .expect(404);
    expect(response.body.error.code).toBe('model-not-found');
    await as.editor.post(`/api/receivers/${unit.id}/install`, { model: elsewhere.model.id, slot: 'wing' }).expect(404);
  });

  it('refuses, with 422, a model whose latest revision does not pass the schema', async () => {
    const broken = await createModelVia(as.editor, roles.workspace.id, {
      name: 'Broken',
      yaml: 'format: bindery-setup/1\nmodel: { name: Broken }\n',
    });
    const unit = await addUnit({ label: 'Patient', outputs: 8 });
    const response = await as.viewer
      .get(`/api/receivers/${unit.id}/reuse-check?model=${broken.model.id}&slot=wing`)
      .expect(422);
    expect(response.body.error.code).toBe('setup-not-valid');
  });
});
