import { QueryTypes } from 'sequelize';
import { beforeAll, describe, expect, it } from 'vitest';
import { parse } from 'yaml';
import { leafValues } from '@shared/lineage/leaf-paths';
import { Revision } from '@api/models';
import { settleRecordings } from '@api/provenance/record-later';
import { createRoleFixture, type RoleFixture } from './helpers/factories';
import { useTestApp } from './helpers/test-app';
import { clientFor, createModelVia, edit, saveVia, TRAINER, type Client } from './models-support';

// Where each value came from (provenance by identity path) and forks that take in
// their source's newer revisions (the three-way merge by identity key).

const t = useTestApp();
let roles: RoleFixture;
let editor: Client;
let owner: Client;
let viewer: Client;

beforeAll(async () => {
  roles = await createRoleFixture();
  editor = clientFor(t.app, t.config, roles.members.editor);
  owner = clientFor(t.app, t.config, roles.members.owner);
  viewer = clientFor(t.app, t.config, roles.members.viewer);
});

const MOTOR_FAILSAFE = 'receivers[id=cabin].map[pin=3].failsafe';
const AILERON_EXPO = 'mixes[id=aileron].expo';

async function provenance(client: Client, modelId: string, query = '') {
  const response = await client.get(`/api/models/${modelId}/provenance${query}`);
  expect(response.status, JSON.stringify(response.body)).toBe(200);
  return response.body.data as {
    path: string;
    revision: { id: string; number: number; model_id: string };
    author: { id: string; name: string };
    message: string;
    created_at: string;
    inherited: boolean;
  }[];
}

const byPath = (entries: Awaited<ReturnType<typeof provenance>>) =>
  new Map(entries.map((entry) => [entry.path, entry]));

async function fork(client: Client, modelId: string, number: number, name: string) {
  const response = await client.post(`/api/models/${modelId}/fork`, { number, workspace: roles.workspace.id, name });
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  return response.body.data as { model: { id: string }; revision: { id: string; number: number } };
}

describe('GET /api/models/:id/provenance/history', () => {
  it('lists every revision that changed a setting, newest first, paged; a parent path holds its settings', async () => {
    const { model, revision: first } = await createModelVia(editor, roles.workspace.id, {
      name: 'History trainer',
      yaml: TRAINER(),
    });
    const idle = edit(TRAINER(), 'failsafe: 1000 }', 'failsafe: 1100 }');
    const second = await saveVia(owner, model.id, 1, idle, 'motor idles on signal loss');
    const third = await saveVia(editor, model.id, 2, edit(idle, 'expo: 30,', 'expo: 35,'), 'softer ailerons');
    const fourth = await saveVia(
      editor,
      model.id,
      3,
      edit(idle, 'expo: 30,', 'expo: 40,').replace('failsafe: 1100 }', 'failsafe: 1050 }'),
      'lower idle, more expo',
    );
    const history = (path: string, query = '') =>
      viewer.get(`/api/models/${model.id}/provenance/history?path=${encodeURIComponent(path)}${query}`);

    const failsafe = (await history(MOTOR_FAILSAFE).expect(200)).body;
    expect(failsafe.pagination).toEqual({ limit: 20, offset: 0, total: 3 });
    expect(failsafe.data.map((change: { revision: { number: number } }) => change.revision.number)).toEqual([4, 2, 1]);
    expect(failsafe.data[1]).toMatchObject({
      revision: { id: second.id, number: 2, parent_id: first.id },
      origin_model_id: model.id,
      author: { id: roles.members.owner.id, name: roles.members.owner.name },
      message: 'motor idles on signal loss',
      inherited: false,
      paths: [MOTOR_FAILSAFE],
    });

    const paged = (await history(MOTOR_FAILSAFE, '&limit=1&offset=1').expect(200)).body;
    expect(paged.pagination).toEqual({ limit: 1, offset: 1, total: 3 });
    expect(paged.data.map((change: { revision: { id: string } }) => change.revision.id)).toEqual([second.id]);
    expect((await history(MOTOR_FAILSAFE, '&offset=9').expect(200)).body).toEqual({
      data: [],
      pagination: { limit: 20, offset: 9, total: 3 },
    });

    // The receiver holds the failsafe: its history lists the revisions that changed it.
    const cabin = (await history('receivers[id=cabin]').expect(200)).body.data;
    expect(cabin.map((change: { revision: { number: number } }) => change.revision.number)).toEqual([4, 2, 1]);
    const expo = (await history(AILERON_EXPO).expect(200)).body.data;
    expect(expo.map((change: { revision: { id: string } }) => change.revision.id)).toEqual([
      fourth.id,
      third.id,
      first.id,
    ]);
    // `receivers[id=cab]` is not a parent of `receivers[id=cabin]`.
    expect((await history('receivers[id=cab').expect(200)).body.data).toEqual([]);
  });

  it('needs a path and a sound page: 400 with the field; 404 for a model the caller cannot see', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'History refusals', yaml: TRAINER() });
    const refused = await viewer.get(`/api/models/${model.id}/provenance/history`).expect(400);
    expect(refused.body.error.details.fields).toHaveProperty('path');
    await viewer.get(`/api/models/${model.id}/provenance/history?path=model.name&limit=0`).expect(400);
    const stranger = clientFor(t.app, t.config, (await createRoleFixture()).members.owner);
    await stranger.get(`/api/models/${model.id}/provenance/history?path=model.name`).expect(404);
  });
});

describe('GET /api/models/:id/provenance', () => {
  it('names the revision that last changed each leaf setting: author, date and message', async () => {
    const { model, revision: first } = await createModelVia(editor, roles.workspace.id, {
      name: 'Provenance trainer',
      yaml: TRAINER(),
    });
    const second = await saveVia(
      owner,
      model.id,
      1,
      edit(TRAINER(), 'failsafe: 1000 }', 'failsafe: 1100 }'),
      'motor idles on signal loss',
    );
    await saveVia(
      editor,
      model.id,
      2,
      edit(edit(TRAINER(), 'failsafe: 1000 }', 'failsafe: 1100 }'), 'expo: 30,', 'expo: 35,'),
      'softer ailerons',
    );

    const all = await provenance(viewer, model.id);
    const latest = await Revision.findOne({ where: { modelId: model.id, number: 3 } });
    expect(all.map((entry) => entry.path)).toEqual([...leafValues(latest!.document).keys()]);
    const entries = byPath(all);
    expect(entries.get(MOTOR_FAILSAFE)).toMatchObject({
      revision: { id: second.id, number: 2, model_id: model.id },
      author: { id: roles.members.owner.id, name: roles.members.owner.name },
      message: 'motor idles on signal loss',
      inherited: false,
    });
    expect(entries.get(AILERON_EXPO)).toMatchObject({ revision: { number: 3 }, message: 'softer ailerons' });
    // Unchanged since revision 1.
    expect(entries.get('receivers[id=cabin].map[pin=1].failsafe')).toMatchObject({
      revision: { id: first.id, number: 1 },
      author: { id: roles.members.editor.id },
    });

    // At an earlier revision, and only under a path.
    const atFirst = await provenance(viewer, model.id, `?revision=${first.id}&path=receivers[id=cabin].map[pin=3]`);
    expect(atFirst.map((entry) => [entry.path, entry.revision.number]).sort()).toEqual([
      ['receivers[id=cabin].map[pin=3].ch', 1],
      [MOTOR_FAILSAFE, 1],
      ['receivers[id=cabin].map[pin=3].pin', 1],
    ]);
  });

  it('computes the rows of revisions saved before the table existed the first time they are asked for', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Older history', yaml: TRAINER() });
    await saveVia(editor, model.id, 1, edit(TRAINER(), 'failsafe: 1000 }', 'failsafe: 1050 }'), 'idle a touch up');
    const before = await provenance(viewer, model.id);
    const sql = t.sequelize;
    await sql.query('DELETE FROM revision_changes WHERE model_id = $id', { bind: { id: model.id } });
    await sql.query('DELETE FROM provenance_progress WHERE model_id = $id', { bind: { id: model.id } });
    expect(await provenance(viewer, model.id)).toEqual(before);
    const [{ count }] = await sql.query<{ count: string }>(
      'SELECT count(*) FROM revision_changes WHERE model_id = $id',
      { bind: { id: model.id }, type: QueryTypes.SELECT },
    );
    expect(Number(count)).toBeGreaterThan(0);
  });

  it('records the changes of a save and an upload as they are saved; a save recorded late reads the same', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Recorded at once', yaml: TRAINER() });
    await saveVia(editor, model.id, 1, edit(TRAINER(), 'expo: 30,', 'expo: 32,'), 'a little more expo');
    const uploaded = edit(TRAINER(), 'failsafe: 1000 }', 'failsafe: 1080 }');
    await editor
      .upload(
        `/api/models/${model.id}/upload`,
        uploaded,
        { name: 'trainer.yaml' },
        { base: 2, message: 'from the bench' },
      )
      .expect(201);
    const sql = t.sequelize;
    const recorded = async () =>
      sql.query<{ through_number: number; rows: string }>(
        `SELECT (SELECT through_number FROM provenance_progress WHERE model_id = $id) AS through_number,
                (SELECT count(*) FROM revision_changes WHERE model_id = $id AND number = 3) AS rows`,
        { bind: { id: model.id }, type: QueryTypes.SELECT },
      );
    // Before anyone asks for provenance, both API saves (one statement each) are recorded
    // once the recordings that follow their answers have run.
    await settleRecordings(sql);
    expect(await recorded()).toEqual([{ through_number: 3, rows: '2' }]);
    const before = await provenance(viewer, model.id);
    expect(byPath(before).get(MOTOR_FAILSAFE)).toMatchObject({ revision: { number: 3 }, message: 'from the bench' });

    // As if the process stopped between the save's commit and the recording of its changes.
    await sql.query('DELETE FROM revision_changes WHERE model_id = $id AND number = 3', { bind: { id: model.id } });
    await sql.query('UPDATE provenance_progress SET through_number = 2 WHERE model_id = $id', {
      bind: { id: model.id },
    });
    expect(await provenance(viewer, model.id)).toEqual(before);
    expect(await recorded()).toEqual([{ through_number: 3, rows: '2' }]);
  });

  it('answers a save whose provenance cannot be recorded; the next provenance read fills it in', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Recorded later', yaml: TRAINER() });
    const sql = t.sequelize;
    // The next insert into revision_changes fails, once: a sequence's value survives the
    // rollback of the transaction that took it.
    await sql.query(`
      CREATE SEQUENCE refuse_provenance_once;
      CREATE FUNCTION refuse_provenance_once() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF nextval('refuse_provenance_once') = 1 THEN RAISE EXCEPTION 'provenance refused for this test'; END IF;
        RETURN NULL;
      END $$;
      CREATE TRIGGER refuse_provenance_once BEFORE INSERT ON revision_changes
        FOR EACH STATEMENT EXECUTE FUNCTION refuse_provenance_once();`);
    try {
      const saved = await saveVia(editor, model.id, 1, edit(TRAINER(), 'expo: 30,', 'expo: 34,'), 'softer still');
      expect(saved.number).toBe(2);
      await settleRecordings(sql);
      const state = async () =>
        sql.query<{ through_number: number; rows: string }>(
          `SELECT (SELECT through_number FROM provenance_progress WHERE model_id = $id) AS through_number,
                  (SELECT count(*) FROM revision_changes WHERE model_id = $id AND number = 2) AS rows`,
          { bind: { id: model.id }, type: QueryTypes.SELECT },
        );
      // The recording after the answer was refused and rolled back whole.
      expect(await state()).toEqual([{ through_number: 1, rows: '0' }]);
      const entries = byPath(await provenance(viewer, model.id));
      expect(entries.get(AILERON_EXPO)).toMatchObject({
        revision: { id: saved.id, number: 2 },
        message: 'softer still',
      });
      expect(entries.get(MOTOR_FAILSAFE)).toMatchObject({ revision: { number: 1 } });
      expect(await state()).toEqual([{ through_number: 2, rows: '1' }]);
    } finally {
      await sql.query(`
        DROP TRIGGER refuse_provenance_once ON revision_changes;
        DROP FUNCTION refuse_provenance_once();
        DROP SEQUENCE refuse_provenance_once;`);
    }
  });

  it('names the source’s revision, marked inherited, for values that came with a fork', async () => {
    const { model: source } = await createModelVia(editor, roles.workspace.id, { name: 'Source', yaml: TRAINER() });
    const fix = await saveVia(owner, source.id, 1, edit(TRAINER(), 'failsafe: 1000 }', 'failsafe: 1100 }'), 'fix');
    const forked = await fork(editor, source.id, 2, 'Source (club copy)');
    const own = await saveVia(
      editor,
      forked.model.id,
      1,
      edit(edit(TRAINER(), 'failsafe: 1000 }', 'failsafe: 1100 }'), 'expo: 30,', 'expo: 25,'),
      'our own expo',
    );
    const entries = byPath(await provenance(viewer, forked.model.id));
    expect(entries.get(MOTOR_FAILSAFE)).toMatchObject({
      revision: { id: fix.id, number: 2, model_id: source.id },
      message: 'fix',
      inherited: true,
    });
    expect(entries.get(AILERON_EXPO)).toMatchObject({
      revision: { id: own.id, model_id: forked.model.id },
      inherited: false,
    });
  });

  it('answers 404 for a revision of another model, 400 for a malformed one, 404 outside the workspace', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'P404', yaml: TRAINER() });
    const other = await createModelVia(editor, roles.workspace.id, { name: 'P404 other', yaml: TRAINER() });
    await viewer.get(`/api/models/${model.id}/provenance?revision=${other.revision.id}`).expect(404);
    await viewer.get(`/api/models/${model.id}/provenance?revision=nope`).expect(400);
    const outsider = clientFor(t.app, t.config, roles.outsider);
    await outsider.get(`/api/models/${model.id}/provenance`).expect(404);
  });
});

describe('/api/models/:id/source-updates', () => {
  async function forkedPair(name: string, sourceText = TRAINER()) {
    const { model: source } = await createModelVia(owner, roles.workspace.id, { name, yaml: sourceText });
    const forked = await fork(editor, source.id, 1, `${name} (fork)`);
    return { sourceId: source.id, forkId: forked.model.id };
  }
  const updates = async (forkId: string) => {
    const response = await viewer.get(`/api/models/${forkId}/source-updates`);
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    return response.body.data;
  };
  const latestText = async (modelId: string) =>
    (await Revision.findOne({ where: { modelId }, order: [['number', 'DESC']] }))!;

  it('brings in a change only the source made, keeps the fork’s own change and its comments, and starts the next merge there', async () => {
    const { sourceId, forkId } = await forkedPair('Fix upstream');
    const fix = await saveVia(owner, sourceId, 1, edit(TRAINER(), 'failsafe: 1000 }', 'failsafe: 1100 }'), 'fix');
    await saveVia(editor, forkId, 1, edit(TRAINER(), 'expo: 20,', 'expo: 25,'), 'our elevator');

    const before = await updates(forkId);
    expect(before).toMatchObject({
      source: { model_id: sourceId, revision_id: fix.id, number: 2 },
      base: { number: 1 },
      ours: { number: 2 },
      behind: 1,
      conflicts: [],
    });
    expect(before.changes.map((change: { path: string }) => change.path)).toEqual([MOTOR_FAILSAFE]);

    const saved = await editor.post(`/api/models/${forkId}/source-updates`, { base: 2 }).expect(201);
    expect(saved.body.data).toMatchObject({ number: 3, origin: 'merge', source_revision_id: fix.id });
    const merged = await latestText(forkId);
    const data = parse(merged.yamlText);
    expect(data.receivers[0].map[2].failsafe).toBe(1100);
    expect(data.mixes[1].expo).toBe(25);
    expect(merged.yamlText).toContain('# motor stops on signal loss');
    expect(merged.yamlText).toContain('(Invented club scenario:');
    expect(await updates(forkId)).toMatchObject({ behind: 0, base: { revision_id: fix.id }, changes: [] });
    await editor
      .post(`/api/models/${forkId}/source-updates`, { base: 3 })
      .expect(422)
      .expect((res) => expect(res.body.error.code).toBe('up-to-date'));

    const entries = byPath(await provenance(viewer, forkId));
    expect(entries.get(MOTOR_FAILSAFE)).toMatchObject({ revision: { id: fix.id }, inherited: true });
  });

  it('both changed one value: a conflict with base, ours and theirs; 422 until a side is chosen', async () => {
    const { sourceId, forkId } = await forkedPair('Both changed');
    await saveVia(owner, sourceId, 1, edit(TRAINER(), 'expo: 30,', 'expo: 35,'), 'theirs');
    await saveVia(editor, forkId, 1, edit(TRAINER(), 'expo: 30,', 'expo: 40,'), 'ours');
    expect((await updates(forkId)).conflicts).toEqual([{ path: AILERON_EXPO, base: 30, ours: 40, theirs: 35 }]);

    const refused = await editor.post(`/api/models/${forkId}/source-updates`, { base: 2 }).expect(422);
    expect(refused.body.error).toMatchObject({ code: 'unresolved-conflicts', details: { paths: [AILERON_EXPO] } });
    expect(await Revision.count({ where: { modelId: forkId } })).toBe(2);

    await editor
      .post(`/api/models/${forkId}/source-updates`, { base: 2, resolutions: { [AILERON_EXPO]: 'theirs' } })
      .expect(201);
    expect(parse((await latestText(forkId)).yamlText).mixes[0].expo).toBe(35);
  });

  it('one side removed an entry the other changed: a conflict at the entry; choosing ours keeps it removed', async () => {
    const { sourceId, forkId } = await forkedPair('Removed and changed');
    await saveVia(
      owner,
      sourceId,
      1,
      edit(
        TRAINER(),
        '- { id: rudder,   from: rudder-stick,   to: 4 }',
        '- { id: rudder,   from: rudder-stick,   to: 4, expo: 10 }',
      ),
    );
    await saveVia(editor, forkId, 1, edit(TRAINER(), '  - { id: rudder,   from: rudder-stick,   to: 4 }\n', ''));
    const { conflicts } = await updates(forkId);
    expect(conflicts).toEqual([
      {
        path: 'mixes[id=rudder]',
        base: { id: 'rudder', from: 'rudder-stick', to: 4 },
        ours: null,
        theirs: { id: 'rudder', from: 'rudder-stick', to: 4, expo: 10 },
      },
    ]);
    await editor
      .post(`/api/models/${forkId}/source-updates`, { base: 2, resolutions: { 'mixes[id=rudder]': 'ours' } })
      .expect(201);
    const mixes = parse((await latestText(forkId)).yamlText).mixes as { id: string }[];
    expect(mixes.map((mix) => mix.id)).toEqual(['aileron', 'elevator', 'motor']);
  });

  it('an entry renamed on one side and changed on the other merges without a conflict', async () => {
    const { sourceId, forkId } = await forkedPair('Renamed');
    await saveVia(owner, sourceId, 1, edit(TRAINER(), '- { id: elevator, from', '- { id: pitch, from'), 'rename');
    await saveVia(editor, forkId, 1, edit(TRAINER(), 'expo: 20,', 'expo: 25,'), 'ours');
    expect((await updates(forkId)).conflicts).toEqual([]);
    await editor.post(`/api/models/${forkId}/source-updates`, { base: 2 }).expect(201);
    const mixes = parse((await latestText(forkId)).yamlText).mixes as { id: string; expo?: number }[];
    expect(mixes[1]).toMatchObject({ id: 'pitch', expo: 25 });
  });

  it('refuses a stale base with 409, a model that is not a fork with 404, a viewer with 403, bad sides with 400', async () => {
    const { sourceId, forkId } = await forkedPair('Stale fork');
    await saveVia(owner, sourceId, 1, edit(TRAINER(), 'expo: 30,', 'expo: 35,'));
    await saveVia(editor, forkId, 1, edit(TRAINER(), 'expo: 20,', 'expo: 21,'));
    const stale = await editor.post(`/api/models/${forkId}/source-updates`, { base: 1 }).expect(409);
    expect(stale.body.error.code).toBe('stale-base');
    const notFork = await viewer.get(`/api/models/${sourceId}/source-updates`).expect(404);
    expect(notFork.body.error.code).toBe('not-a-fork');
    await viewer.post(`/api/models/${forkId}/source-updates`, { base: 2 }).expect(403);
    await editor.post(`/api/models/${forkId}/source-updates`, { base: 2, resolutions: { x: 'mine' } }).expect(400);
    expect(await Revision.count({ where: { modelId: forkId } })).toBe(2);
  });
});
