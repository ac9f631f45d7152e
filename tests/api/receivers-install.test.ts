import { parse } from 'yaml';
import { beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent, Receiver, ReceiverInstall } from '@api/models';
import { createRoleFixture, type RoleFixture } from './helpers/factories';
import { useTestApp } from './helpers/test-app';
import { clientFor, createModelVia, edit, fixture, saveVia, SCALE, TRAINER, type Client } from './models-support';

const t = useTestApp();
let roles: RoleFixture;
let editor: Client;
let owner: Client;

interface ModelRef {
  id: string;
  revisionId: string;
}

const unitFixture = (name: string) => parse(fixture(`reuse/${name}.yaml`)) as Record<string, unknown>;

async function addUnit(body: Record<string, unknown>): Promise<string> {
  const response = await editor.post(`/api/workspaces/${roles.workspace.id}/receivers`, body);
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  return response.body.data.id;
}

// Each test takes models of its own, so one test's installs never fill another's slots.
async function newModel(name: string, yaml = SCALE()): Promise<ModelRef> {
  const created = await createModelVia(editor, roles.workspace.id, { name, yaml });
  return { id: created.model.id, revisionId: created.revision.id };
}

const install = (id: string, body: Record<string, unknown>, client = editor) =>
  client.post(`/api/receivers/${id}/install`, body);
const history = async (id: string) => (await editor.get(`/api/receivers/${id}/history`).expect(200)).body.data;

beforeAll(async () => {
  roles = await createRoleFixture();
  editor = clientFor(t.app, t.config, roles.members.editor);
  owner = clientFor(t.app, t.config, roles.members.owner);
});

describe('POST /api/receivers/:id/install', () => {
  it('installs a free unit and answers its reuse check, with the install', async () => {
    const kestrel = await newModel('Kestrel Mk II');
    const id = await addUnit(unitFixture('trainer-unit'));
    const response = await install(id, { model: kestrel.id, slot: 'wing' }).expect(201);
    const { data } = response.body;
    expect(data).toMatchObject({
      ready: false,
      installed_here: true,
      revision: { id: kestrel.revisionId, number: 1 },
      slot: { id: 'wing' },
      receiver: {
        id,
        status: 'installed',
        installed: { model: { id: kestrel.id, name: 'Kestrel Mk II' }, slot: 'wing' },
        readiness: { state: 'changes', changes: 13 },
      },
      install: {
        receiver_id: id,
        model: { id: kestrel.id },
        slot: 'wing',
        revision_id: kestrel.revisionId,
        to: null,
        installed_by: { id: roles.members.editor.id },
      },
      moved_from: null,
    });
    expect(data.changes).toHaveLength(13);
    const [event] = await AuditEvent.findAll({ where: { subjectId: id, action: 'receiver.installed' } });
    expect(event.details).toMatchObject({
      model_id: kestrel.id,
      slot: 'wing',
      revision_number: 1,
      ready: false,
      changes: 13,
      moved_from: null,
    });
  });

  it('refuses a unit still installed elsewhere with 409 installed-elsewhere, and changes nothing', async () => {
    const kestrel = await newModel('Kestrel Mk II');
    const meadowlark = await newModel('Meadowlark 40', TRAINER());
    const id = await addUnit(unitFixture('six-output-unit'));
    await install(id, { model: meadowlark.id, slot: 'cabin' }).expect(201);
    const response = await install(id, { model: kestrel.id, slot: 'fuselage' }).expect(409);
    expect(response.body.error).toMatchObject({
      code: 'installed-elsewhere',
      details: { model: { id: meadowlark.id, name: 'Meadowlark 40' }, slot: 'cabin' },
    });
    const installs = await ReceiverInstall.findAll({ where: { receiverId: id } });
    expect(installs.map((row) => [row.modelId, row.slot, row.removedAt])).toEqual([[meadowlark.id, 'cabin', null]]);
  });

  it('refuses the slot it is already in with 409 already-installed', async () => {
    const kestrel = await newModel('Kestrel Mk II');
    const id = await addUnit({ label: 'Twice', outputs: 8 });
    await install(id, { model: kestrel.id, slot: 'fuselage' }).expect(201);
    const response = await install(id, { model: kestrel.id, slot: 'fuselage', move: true }).expect(409);
    expect(response.body.error.code).toBe('already-installed');
    await editor.post(`/api/receivers/${id}/remove`).expect(200);
  });

  it('refuses a slot that holds another unit with 409 slot-occupied, naming it', async () => {
    const first = await addUnit({ label: 'First in', outputs: 8 });
    const second = await addUnit({ label: 'Second in', outputs: 8 });
    const model = await createModelVia(editor, roles.workspace.id, { name: 'Crowded', yaml: SCALE() });
    await install(first, { model: model.model.id, slot: 'fuselage' }).expect(201);
    const response = await install(second, { model: model.model.id, slot: 'fuselage' }).expect(409);
    expect(response.body.error).toMatchObject({
      code: 'slot-occupied',
      details: { slot: 'fuselage', receiver: { id: first, label: 'First in' } },
    });
  });

  it('lets exactly one of two units racing for one slot in', async () => {
    const model = await createModelVia(editor, roles.workspace.id, { name: 'Race', yaml: SCALE() });
    const units = await Promise.all([1, 2, 3, 4].map((n) => addUnit({ label: `Racer ${n}`, outputs: 8 })));
    const answers = await Promise.all(units.map((id) => install(id, { model: model.model.id, slot: 'wing' })));
    expect(answers.map((answer) => answer.status).sort()).toEqual([201, 409, 409, 409]);
    expect(
      answers.filter((answer) => answer.status === 409).every((answer) => answer.body.error.code === 'slot-occupied'),
    ).toBe(true);
    expect(await ReceiverInstall.count({ where: { modelId: model.model.id, removedAt: null } })).toBe(1);
  });

  it('refuses a slot the latest revision does not have (422) and bad input (400)', async () => {
    const kestrel = await newModel('Kestrel Mk II');
    const id = await addUnit({ label: 'Lost', outputs: 8 });
    const missing = await install(id, { model: kestrel.id, slot: 'tail' }).expect(422);
    expect(missing.body.error.code).toBe('slot-not-found');
    await install(id, { model: kestrel.id }).expect(400);
    await install(id, { model: kestrel.id, slot: 'wing', move: 'yes' }).expect(400);
    expect(await ReceiverInstall.count({ where: { receiverId: id } })).toBe(0);
  });
});

describe('move, remove and the history', () => {
  it('moves a unit in one step with move: true, recording the end of one stay and the start of the next', async () => {
    const kestrel = await newModel('Kestrel Mk II');
    const meadowlark = await newModel('Meadowlark 40', TRAINER());
    const id = await addUnit(unitFixture('six-output-unit'));
    const first = (await install(id, { model: meadowlark.id, slot: 'cabin' }).expect(201)).body.data.install;
    const moved = (await install(id, { model: kestrel.id, slot: 'fuselage', move: true }, owner).expect(201)).body.data;
    expect(moved.moved_from).toMatchObject({
      id: first.id,
      model: { id: meadowlark.id },
      slot: 'cabin',
      to: expect.any(String),
      removed_by: { id: roles.members.owner.id },
    });
    expect(moved.install).toMatchObject({ model: { id: kestrel.id }, slot: 'fuselage', to: null });
    expect(moved.moved_from.to).toBe(moved.install.from);

    const { installs, events } = await history(id);
    expect(
      installs.map((row: { model: { name: string }; slot: string; to: string | null }) => [
        row.model.name,
        row.slot,
        row.to === null,
      ]),
    ).toEqual([
      ['Kestrel Mk II', 'fuselage', true],
      ['Meadowlark 40', 'cabin', false],
    ]);
    expect(events.map((event: { action: string }) => event.action)).toEqual([
      'receiver.installed',
      'receiver.removed',
      'receiver.installed',
      'receiver.added',
    ]);
    expect(events[1].details).toMatchObject({
      model_id: meadowlark.id,
      slot: 'cabin',
      moved_to: { model_id: kestrel.id, slot: 'fuselage' },
    });
    expect(events[0].details).toMatchObject({ moved_from: { model_id: meadowlark.id, slot: 'cabin' } });
  });

  it('removes a unit back to the shelf, then 409 not-installed when it is already free', async () => {
    const kestrel = await newModel('Kestrel Mk II');
    const id = await addUnit({ label: 'In and out', outputs: 8 });
    await install(id, { model: kestrel.id, slot: 'fuselage' }).expect(201);
    const removed = (await editor.post(`/api/receivers/${id}/remove`).expect(200)).body.data;
    expect(removed.receiver).toMatchObject({ status: 'free', installed: null, readiness: null });
    expect(removed.install).toMatchObject({
      slot: 'fuselage',
      to: expect.any(String),
      removed_by: { id: roles.members.editor.id },
    });
    const again = await editor.post(`/api/receivers/${id}/remove`).expect(409);
    expect(again.body.error.code).toBe('not-installed');

    // The slot is free again for another unit.
    const next = await addUnit({ label: 'Next in', outputs: 8 });
    await install(next, { model: kestrel.id, slot: 'fuselage' }).expect(201);
    await editor.post(`/api/receivers/${next}/remove`).expect(200);

    const { installs, events } = await history(id);
    expect(installs).toHaveLength(1);
    expect(events.map((event: { action: string }) => event.action)).toEqual([
      'receiver.removed',
      'receiver.installed',
      'receiver.added',
    ]);
  });
});

describe('POST /api/receivers/:id/apply', () => {
  it('records the slot’s settings as the unit’s stored settings, audits before and after, and makes it ready', async () => {
    const kestrel = await newModel('Kestrel Mk II');
    const id = await addUnit(unitFixture('trainer-unit'));
    const installed = (await install(id, { model: kestrel.id, slot: 'wing' }).expect(201)).body.data;
    const before = (await Receiver.findByPk(id))!.storedSettings;

    const applied = (await editor.post(`/api/receivers/${id}/apply`, { revision: installed.revision.id }).expect(200))
      .body.data;
    expect(applied).toMatchObject({
      ready: true,
      changes: [],
      receiver: { readiness: { state: 'ready', changes: 0 }, telemetry: false },
    });

    const stored = (await Receiver.findByPk(id))!.storedSettings!;
    expect(stored.telemetry).toBe(false);
    expect(stored.pins.map((entry) => [entry.pin, entry.ch, entry.failsafe])).toEqual([
      [1, 9, 1500],
      [2, 10, 'hold'],
      [3, 11, 'hold'],
      [4, 12, 'hold'],
      [5, 13, 'hold'],
      [6, 14, 'hold'],
      [7, 15, 1500],
      [8, 16, 1500],
    ]);
    const [event] = await AuditEvent.findAll({ where: { subjectId: id, action: 'receiver.settings-applied' } });
    expect(event.actorId).toBe(roles.members.editor.id);
    expect(event.details).toMatchObject({
      model_id: kestrel.id,
      slot: 'wing',
      revision_number: 1,
      before,
      after: stored,
    });
    expect((event.details.changes as unknown[]).length).toBe(installed.changes.length);

    const check = (await editor.get(`/api/receivers/${id}/reuse-check?model=${kestrel.id}&slot=wing`).expect(200)).body
      .data;
    expect(check).toMatchObject({ ready: true, changes: [], installed_here: true });
  });

  it('refuses a unit that is not installed (409) and one short of outputs (422), storing nothing', async () => {
    const free = await addUnit(unitFixture('trainer-unit'));
    expect((await editor.post(`/api/receivers/${free}/apply`).expect(409)).body.error.code).toBe('not-installed');

    const small = await addUnit(unitFixture('six-output-unit'));
    const model = await createModelVia(editor, roles.workspace.id, { name: 'Too big for it', yaml: SCALE() });
    await install(small, { model: model.model.id, slot: 'wing' }).expect(201);
    const before = (await Receiver.findByPk(small))!.storedSettings;
    const refused = await editor.post(`/api/receivers/${small}/apply`).expect(422);
    expect(refused.body.error.code).toBe('unit-cannot-carry');
    expect((await Receiver.findByPk(small))!.storedSettings).toEqual(before);
  });

  it('refuses settings from a revision that is no longer the latest (409 stale-revision)', async () => {
    const model = await createModelVia(editor, roles.workspace.id, { name: 'Moving target', yaml: SCALE() });
    const id = await addUnit(unitFixture('trainer-unit'));
    const seen = (await install(id, { model: model.model.id, slot: 'wing' }).expect(201)).body.data.revision.id;
    const newer = await saveVia(
      editor,
      model.model.id,
      1,
      edit(SCALE(), '{ pin: 1, ch: 9,  failsafe: 1500 }', '{ pin: 1, ch: 9,  failsafe: 1450 }'),
    );
    const refused = await editor.post(`/api/receivers/${id}/apply`, { revision: seen }).expect(409);
    expect(refused.body.error).toMatchObject({
      code: 'stale-revision',
      details: { latest: { id: newer.id, number: 2 } },
    });

    // The check now runs against revision 2, whose pin 1 fails safe to 1450 µs.
    const check = (await editor.get(`/api/receivers/${id}/reuse-check?model=${model.model.id}&slot=wing`).expect(200))
      .body.data;
    expect(check.revision.number).toBe(2);
    expect(check.changes).toContainEqual({
      pin: 1,
      setting: 'failsafe',
      from: 1500,
      to: 1450,
      summary: 'Pin 1: failsafe 1500 µs, set 1450 µs',
    });
    await editor.post(`/api/receivers/${id}/apply`, { revision: newer.id }).expect(200);
    expect((await Receiver.findByPk(id))!.storedSettings!.pins[0]).toEqual({ pin: 1, ch: 9, failsafe: 1450 });
  });
});

describe('the history of a unit', () => {
  it('pages where it has been and what was recorded, each list on its own, with their totals', async () => {
    const heron = await newModel('Heron');
    const id = await addUnit(unitFixture('trainer-unit'));
    for (let stay = 0; stay < 3; stay += 1) {
      await install(id, { model: heron.id, slot: 'wing' }).expect(201);
      await editor.post(`/api/receivers/${id}/remove`).expect(200);
    }
    // Put on the shelf, then three stays of one install and one removal each.
    const first = await editor.get(`/api/receivers/${id}/history?limit=2`).expect(200);
    expect(first.body.data.installs).toHaveLength(2);
    expect(first.body.data.events.map((event: { action: string }) => event.action)).toEqual([
      'receiver.removed',
      'receiver.installed',
    ]);
    expect(first.body.pagination).toEqual({
      installs: { limit: 2, offset: 0, total: 3 },
      events: { limit: 2, offset: 0, total: 7 },
    });
    const older = await editor
      .get(`/api/receivers/${id}/history?limit=2&installs_offset=2&events_offset=6`)
      .expect(200);
    expect(older.body.data.installs).toHaveLength(1);
    expect(older.body.data.events.map((event: { action: string }) => event.action)).toEqual(['receiver.added']);
    const everything = await history(id);
    expect(everything.installs).toHaveLength(3);
  });
});
