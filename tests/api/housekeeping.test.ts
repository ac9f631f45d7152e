import { execFileSync } from 'node:child_process';
import { mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent, Revision, SetupModel, Workspace } from '@api/models';
import { seedDemo } from '@api/seed';
import { DEMO_WORKSPACE_NAME } from '@api/seed/demo-data';
import { createRoleFixture, type RoleFixture } from './helpers/factories';
import { useTestApp } from './helpers/test-app';
import { clientFor, createModelVia, edit, fixture, saveVia, TRAINER, type Client } from './models-support';

// The hangar's housekeeping: only setup files become models; renames keep the record
// and the setup's own model.name in step; archived models leave the hangar's list but
// nothing else.

const t = useTestApp();
let roles: RoleFixture;
let editor: Client;
let viewer: Client;

beforeAll(async () => {
  roles = await createRoleFixture();
  editor = clientFor(t.app, t.config, roles.members.editor);
  viewer = clientFor(t.app, t.config, roles.members.viewer);
});

const binary = (test: request.Test) =>
  test.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (chunk: Buffer) => chunks.push(chunk));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  });

const SHOPPING_LIST = 'milk: 2\neggs: 12\nbread: wholemeal\n';
const countModels = () => SetupModel.count({ where: { workspaceId: roles.workspace.id } });

describe('only a setup file becomes a model', () => {
  it('refuses an upload without format: bindery-setup/1 with a 422 that says what a setup file looks like, and stores nothing', async () => {
    const before = await countModels();
    const response = await editor
      .upload(`/api/workspaces/${roles.workspace.id}/models/upload`, SHOPPING_LIST, { name: 'shopping.yaml' })
      .expect(422);
    expect(response.body.error.code).toBe('not-a-setup');
    expect(response.body.error.message).toContain('has no format line');
    expect(response.body.error.message).toContain('format: bindery-setup/1');
    expect(response.body.error.message).toMatch(/model .*link .*controls, channels, mixes and receivers/);
    expect(response.body.error.details).toEqual({ format: null, expected: 'bindery-setup/1' });
    expect(await countModels()).toBe(before);
  });

  it('refuses create with YAML of another format, and a revision upload without the format line', async () => {
    const before = await countModels();
    const other = edit(TRAINER(), 'format: bindery-setup/1', 'format: bindery-setup/9');
    const response = await editor
      .post(`/api/workspaces/${roles.workspace.id}/models`, { name: 'Wrong format', yaml: other })
      .expect(422);
    expect(response.body.error.message).toContain('says format: "bindery-setup/9"');
    expect(await countModels()).toBe(before);

    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Upload target', yaml: TRAINER() });
    const refused = await editor
      .upload(`/api/models/${model.id}/upload`, SHOPPING_LIST, { name: 'list.yaml' }, { base: 1 })
      .expect(422);
    expect(refused.body.error.code).toBe('not-a-setup');
    expect(await Revision.count({ where: { modelId: model.id } })).toBe(1);
  });

  it('still takes every readable fixture setup, errors and all (history keeps everything)', async () => {
    const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../fixtures');
    const files = ['valid', 'invalid', 'pairs'].flatMap((folder) =>
      readdirSync(path.join(root, folder))
        .filter((name) => name.endsWith('.yaml') && !name.startsWith('syntax'))
        .map((name) => `${folder}/${name}`),
    );
    expect(files.length).toBeGreaterThan(50);
    for (const file of files) {
      const response = await editor.upload(`/api/workspaces/${roles.workspace.id}/models/upload`, fixture(file), {
        name: path.basename(file),
      });
      expect(response.status, `${file}: ${JSON.stringify(response.body.error)}`).toBe(201);
    }
  });

  it('still takes every revision of the demo seed as an upload', async () => {
    await seedDemo(t.sequelize);
    const demo = (await Workspace.findOne({ where: { name: DEMO_WORKSPACE_NAME } }))!;
    const revisions = await Revision.findAll({
      include: [{ model: SetupModel, as: 'model', required: true, where: { workspaceId: demo.id } }],
    });
    expect(revisions.length).toBeGreaterThan(10);
    for (const revision of revisions) {
      const response = await editor.upload(`/api/workspaces/${roles.workspace.id}/models/upload`, revision.yamlText, {
        name: 'demo.yaml',
      });
      expect(response.status, JSON.stringify(response.body.error)).toBe(201);
    }
  });
});

describe('renaming keeps the model and its setup in step', () => {
  it('a save that changes model.name in the text renames a model that was in step with it, audited; a name given on purpose stays', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Meadowlark 40', yaml: TRAINER() });
    const renamed = edit(TRAINER(), 'name: Meadowlark 40', 'name: Meadowlark 40 Mk 2');
    await saveVia(editor, model.id, 1, renamed);
    expect((await SetupModel.findByPk(model.id))!.name).toBe('Meadowlark 40 Mk 2');
    const event = await AuditEvent.findOne({ where: { subjectId: model.id, action: 'model.renamed' } });
    expect(event!.details).toMatchObject({ from: 'Meadowlark 40', to: 'Meadowlark 40 Mk 2', number: 2 });
    // A name given on purpose (not the text's) survives saves, even one that renames the text.
    const { model: named } = await createModelVia(editor, roles.workspace.id, {
      name: 'Club trainer',
      yaml: TRAINER(),
    });
    await saveVia(editor, named.id, 1, edit(TRAINER(), 'expo: 30,', 'expo: 25,'));
    await saveVia(editor, named.id, 2, edit(renamed, 'expo: 30,', 'expo: 25,'));
    expect((await SetupModel.findByPk(named.id))!.name).toBe('Club trainer');
    expect(await AuditEvent.count({ where: { subjectId: named.id, action: 'model.renamed' } })).toBe(0);
  });

  it('the rename shows in history and in the compare as the one changed line', async () => {
    const { model, revision } = await createModelVia(editor, roles.workspace.id, { name: 'Wren', yaml: TRAINER() });
    const body = (await editor.patch(`/api/models/${model.id}`, { name: 'Wren Twin' }).expect(200)).body;
    const history = (await viewer.get(`/api/models/${model.id}/revisions`).expect(200)).body.data;
    expect(history[0]).toMatchObject({ number: 2, message: 'Renamed the model from “Wren” to “Wren Twin”' });
    const compare = (await viewer.get(`/api/compare?from=${revision.id}&to=${body.revision.id}`).expect(200)).body.data;
    expect(compare.changes).toHaveLength(1);
    expect(compare.changes[0]).toMatchObject({ kind: 'changed', path: 'model.name', before: 'Meadowlark 40' });
    // Renaming to the name it has saves nothing.
    await editor.patch(`/api/models/${model.id}`, { name: 'Wren Twin' }).expect(200);
    expect(await Revision.count({ where: { modelId: model.id } })).toBe(2);
  });

  it('is refused for viewers and reviewers', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Kept', yaml: TRAINER() });
    for (const role of ['viewer', 'reviewer'] as const)
      await clientFor(t.app, t.config, roles.members[role])
        .patch(`/api/models/${model.id}`, { name: 'No' })
        .expect(403);
    expect((await SetupModel.findByPk(model.id))!.name).toBe('Kept');
  });
});

describe('archive and unarchive', () => {
  it('hides an archived model from the hangar by default, lists it on request, and audits both ways', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Retired glider', yaml: TRAINER() });
    const listed = async (query = '') =>
      (await viewer.get(`/api/workspaces/${roles.workspace.id}/models?q=Retired${query}`).expect(200)).body as {
        data: { id: string; archived_at: string | null }[];
        pagination: { archived: number };
      };
    expect((await listed()).data.map((row) => row.id)).toEqual([model.id]);

    const archived = (await editor.post(`/api/models/${model.id}/archive`).expect(200)).body.data;
    expect(archived.archived_at).toEqual(expect.any(String));
    expect((await listed()).data).toEqual([]);
    expect((await listed()).pagination.archived).toBe(1);
    expect((await listed('&archived=include')).data.map((row) => row.id)).toEqual([model.id]);
    expect((await listed('&archived=only')).data[0].archived_at).toBe(archived.archived_at);
    await viewer.get(`/api/workspaces/${roles.workspace.id}/models?archived=maybe`).expect(400);

    // Archiving twice records nothing more.
    await editor.post(`/api/models/${model.id}/archive`).expect(200);
    expect(await AuditEvent.count({ where: { subjectId: model.id, action: 'model.archived' } })).toBe(1);

    const back = (await editor.post(`/api/models/${model.id}/unarchive`).expect(200)).body.data;
    expect(back.archived_at).toBeNull();
    expect((await listed()).data.map((row) => row.id)).toEqual([model.id]);
    const events = await AuditEvent.findAll({ where: { subjectId: model.id }, order: [['createdAt', 'ASC']] });
    expect(events.map((event) => event.action)).toEqual(['model.created', 'model.archived', 'model.unarchived']);
    expect(events[1].actorId).toBe(roles.members.editor.id);
  });

  it('never deletes: an archived model still answers its page, history, revisions and exports', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Shelved', yaml: TRAINER() });
    await saveVia(editor, model.id, 1, edit(TRAINER(), 'expo: 30,', 'expo: 20,'));
    await editor.post(`/api/models/${model.id}/archive`).expect(200);
    expect((await viewer.get(`/api/models/${model.id}`).expect(200)).body.data.archived_at).not.toBeNull();
    const history = (await viewer.get(`/api/models/${model.id}/revisions`).expect(200)).body.data;
    expect(history.map((row: { number: number }) => row.number)).toEqual([2, 1]);
    expect((await viewer.get(`/api/models/${model.id}/revisions/1`).expect(200)).body.data.yaml).toBe(TRAINER());
    const bundle = await viewer.get(`/api/models/${model.id}/export.git`).expect(200);
    expect(bundle.headers['content-disposition']).toBe('attachment; filename=shelved.bundle');
    const owner = clientFor(t.app, t.config, roles.members.owner);
    const whole = await binary(owner.get(`/api/workspaces/${roles.workspace.id}/export.git`)).expect(200);
    // The workspace bundle has a folder for every model, the archived one too.
    const folder = mkdtempSync(path.join(tmpdir(), 'bindery-archive-'));
    try {
      writeFileSync(path.join(folder, 'all.bundle'), whole.body as Buffer);
      execFileSync('git', ['clone', '--quiet', path.join(folder, 'all.bundle'), path.join(folder, 'all')]);
      const folders = execFileSync('git', ['-C', path.join(folder, 'all'), 'ls-tree', '--name-only', 'HEAD'], {
        encoding: 'utf8',
      });
      expect(folders.split('\n')).toContain('shelved');
    } finally {
      rmSync(folder, { recursive: true, force: true });
    }
  });

  it('is refused for viewers and reviewers', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Not theirs to hide', yaml: TRAINER() });
    for (const role of ['viewer', 'reviewer'] as const)
      await clientFor(t.app, t.config, roles.members[role]).post(`/api/models/${model.id}/archive`).expect(403);
    expect((await SetupModel.findByPk(model.id))!.archivedAt).toBeNull();
  });
});
