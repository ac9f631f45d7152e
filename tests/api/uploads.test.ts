import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { Revision, SetupModel } from '@api/models';
import { createRoleFixture, type RoleFixture } from './helpers/factories';
import { useTestApp } from './helpers/test-app';
import { ALIAS_BOMB, clientFor, createModelVia, GLIDER, SCALE, TRAINER, type Client } from './models-support';

const t = useTestApp();
let roles: RoleFixture;
let editor: Client;

beforeAll(async () => {
  roles = await createRoleFixture();
  editor = clientFor(t.app, t.config, roles.members.editor);
});

const revisionCount = (modelId: string) => Revision.count({ where: { modelId } });

describe('POST /api/models/:id/upload', () => {
  it('saves an uploaded .yaml file as the next revision, byte for byte', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Upload target', yaml: TRAINER() });
    const text = `# exported on the bench\r\n${SCALE()}`;
    const response = await editor
      .upload(
        `/api/models/${model.id}/upload`,
        text,
        { name: 'kestrel.yaml', type: 'application/octet-stream' },
        { base: 1, message: 'From the laptop' },
      )
      .expect(201);
    expect(response.body.data).toMatchObject({
      number: 2,
      origin: 'upload',
      message: 'From the laptop',
      error_count: 0,
    });
    expect((await Revision.findByPk(response.body.data.id))!.yamlText).toBe(text);
    const download = await editor.get(`/api/revisions/${response.body.data.id}?format=yaml`).expect(200);
    expect(download.text).toBe(text);
  });

  it.each([
    ['a .yml file sent as text/plain', 'setup.yml', 'text/plain'],
    ['a file of any name sent as text/yaml', 'setup.txt', 'text/yaml'],
    ['a .YAML file sent as application/x-yaml', 'SETUP.YAML', 'application/x-yaml'],
  ])('accepts %s, naming the file in the default message', async (_label, name, type) => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: `Accepts ${name}`, yaml: TRAINER() });
    const response = await editor
      .upload(`/api/models/${model.id}/upload`, GLIDER(), { name, type }, { base: 1 })
      .expect(201);
    expect(response.body.data.message).toBe(`Uploaded ${name}`);
  });

  it('answers a file over 512 KB with 413 too-large and stores nothing', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Too large', yaml: TRAINER() });
    const big = `${TRAINER()}# ${'x'.repeat(513 * 1024)}\n`;
    const response = await editor.upload(`/api/models/${model.id}/upload`, big, { name: 'big.yaml' }, { base: 1 });
    expect(response.status).toBe(413);
    expect(response.body.error.code).toBe('too-large');
    expect(await revisionCount(model.id)).toBe(1);
  });

  it('accepts a file of exactly 512 KB', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'At the limit', yaml: TRAINER() });
    const head = `${TRAINER()}# `;
    const exact = `${head}${'x'.repeat(512 * 1024 - Buffer.byteLength(head) - 1)}\n`;
    expect(Buffer.byteLength(exact)).toBe(512 * 1024);
    await editor.upload(`/api/models/${model.id}/upload`, exact, { name: 'exact.yaml' }, { base: 1 }).expect(201);
  });

  it.each([
    ['an image', 'photo.png', 'image/png', TRAINER()],
    ['an unknown binary type with a non-YAML name', 'setup.bin', 'application/octet-stream', TRAINER()],
    ['a PDF named .yaml', 'setup.yaml', 'application/pdf', TRAINER()],
    ['JSON', 'setup.json', 'application/json', '{"format": "bindery-setup/1"}'],
  ])('answers %s with 415 and stores nothing', async (_label, name, type, text) => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: `Refuses ${name}`, yaml: TRAINER() });
    const response = await editor
      .upload(`/api/models/${model.id}/upload`, text, { name, type }, { base: 1 })
      .expect(415);
    expect(response.body.error.code).toBe('unsupported-media-type');
    expect(await revisionCount(model.id)).toBe(1);
  });

  it('answers bytes that are not UTF-8 text with 415', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Binary', yaml: TRAINER() });
    const bytes = Buffer.from([0x66, 0x6f, 0x72, 0x6d, 0x61, 0x74, 0x3a, 0x20, 0xff, 0xfe, 0x00, 0x0a]);
    await editor.upload(`/api/models/${model.id}/upload`, bytes, { name: 'setup.yaml' }, { base: 1 }).expect(415);
    expect(await revisionCount(model.id)).toBe(1);
  });

  it('answers a JSON body with 415: uploads are multipart', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Not multipart', yaml: TRAINER() });
    const response = await editor.post(`/api/models/${model.id}/upload`, { base: 1, yaml: TRAINER() }).expect(415);
    expect(response.body.error.code).toBe('unsupported-media-type');
  });

  it('refuses a stale base (409), a missing base or file (400) and an unreadable file or alias bomb (422)', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Upload rules', yaml: TRAINER() });
    const url = `/api/models/${model.id}/upload`;
    expect((await editor.upload(url, GLIDER(), {}, { base: 2 }).expect(409)).body.error).toMatchObject({
      code: 'stale-base',
      details: { latest: 1 },
    });
    expect((await editor.upload(url, GLIDER(), {}).expect(400)).body.error.details.fields).toHaveProperty('base');
    expect(
      (await editor.upload(url, GLIDER(), {}, { base: '1.0' }).expect(400)).body.error.details.fields,
    ).toHaveProperty('base');
    expect(
      (await editor.upload(url, GLIDER(), {}, { base: 1, colour: 'red' }).expect(400)).body.error.details.fields,
    ).toHaveProperty('colour');
    const noFile = await request(t.app).post(url).set(editor.headers).field('base', '1').expect(400);
    expect(noFile.body.error.code).toBe('file-missing');
    const wrongField = await request(t.app)
      .post(url)
      .set(editor.headers)
      .field('base', '1')
      .attach('setup', Buffer.from(GLIDER()), 'g.yaml')
      .expect(400);
    expect(wrongField.body.error.code).toBe('invalid-upload');
    expect((await editor.upload(url, 'model: [1,\n', {}, { base: 1 }).expect(422)).body.error.code).toBe(
      'unreadable-setup',
    );
    expect((await editor.upload(url, ALIAS_BOMB, {}, { base: 1 }).expect(422)).body.error.code).toBe(
      'unreadable-setup',
    );
    expect(await revisionCount(model.id)).toBe(1);
  });

  it('answers a malformed multipart body with 400, not a crash', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Malformed', yaml: TRAINER() });
    const url = `/api/models/${model.id}/upload`;
    const noBoundary = await request(t.app)
      .post(url)
      .set(editor.headers)
      .set('Content-Type', 'multipart/form-data')
      .send('--x\r\n');
    expect(noBoundary.status).toBe(400);
    expect(noBoundary.body.error.code).toBe('malformed-upload');
    const cutOff = await request(t.app)
      .post(url)
      .set(editor.headers)
      .set('Content-Type', 'multipart/form-data; boundary=edge')
      .send('--edge\r\nContent-Disposition: form-data; name="file"; filename="a.yaml"\r\n\r\nformat: bindery');
    expect(cutOff.status).toBe(400);
    expect(await revisionCount(model.id)).toBe(1);
  });

  it('is refused to viewers and reviewers before the file is read, and 404 outside the workspace', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Upload roles', yaml: TRAINER() });
    for (const role of ['viewer', 'reviewer'] as const) {
      const response = await clientFor(t.app, t.config, roles.members[role])
        .upload(`/api/models/${model.id}/upload`, GLIDER(), {}, { base: 1 })
        .expect(403);
      expect(response.body.error.code).toBe('role-too-low');
    }
    await clientFor(t.app, t.config, roles.outsider)
      .upload(`/api/models/${model.id}/upload`, GLIDER(), {}, { base: 1 })
      .expect(404);
    expect(await revisionCount(model.id)).toBe(1);
  });
});

describe('POST /api/workspaces/:ws/models/upload', () => {
  it("creates a model from a file, named after the setup's own model name", async () => {
    const response = await editor
      .upload(`/api/workspaces/${roles.workspace.id}/models/upload`, GLIDER(), {
        name: 'club-glider.yml',
        type: 'text/plain',
      })
      .expect(201);
    const { model, revision } = response.body.data;
    expect(model).toMatchObject({ name: 'Sedge 3.4', airframe: 'glider', latest: { number: 1 } });
    expect(revision).toMatchObject({ number: 1, origin: 'upload', message: 'Uploaded club-glider.yml' });
    expect((await Revision.findByPk(revision.id))!.yamlText).toBe(GLIDER());
  });

  it('takes a name and message from the form, and falls back to the file name for a setup without a name', async () => {
    const named = await editor
      .upload(
        `/api/workspaces/${roles.workspace.id}/models/upload`,
        TRAINER(),
        {},
        { name: 'Club trainer', message: 'Saturday setup' },
      )
      .expect(201);
    expect(named.body.data.model.name).toBe('Club trainer');
    expect(named.body.data.revision.message).toBe('Saturday setup');
    const nameless = await editor
      .upload(`/api/workspaces/${roles.workspace.id}/models/upload`, 'format: bindery-setup/1\n', {
        name: 'half-done.yaml',
      })
      .expect(201);
    expect(nameless.body.data.model.name).toBe('half-done');
    expect(nameless.body.data.revision.error_count).toBeGreaterThan(0);
  });

  it('creates nothing for a refused file', async () => {
    const before = await SetupModel.count();
    const url = `/api/workspaces/${roles.workspace.id}/models/upload`;
    await editor.upload(url, `${'x: 1\n'.repeat(110_000)}`, {}).expect(413);
    await editor.upload(url, TRAINER(), { name: 'a.png', type: 'image/png' }).expect(415);
    await editor.upload(url, '{ broken', {}).expect(422);
    await clientFor(t.app, t.config, roles.members.reviewer).upload(url, TRAINER(), {}).expect(403);
    expect(await SetupModel.count()).toBe(before);
  });
});
