import { QueryTypes } from 'sequelize';
import { beforeAll, describe, expect, it } from 'vitest';
import { contentHash } from '@shared/canonical/content-hash';
import { analyzeSetup } from '@shared/analyze';
import { AuditEvent, Revision, SetupModel } from '@api/models';
import { createRoleFixture, type RoleFixture } from './helpers/factories';
import { useTestApp } from './helpers/test-app';
import {
  ALIAS_BOMB,
  clientFor,
  createModelVia,
  edit,
  fixture,
  SCALE,
  saveVia,
  TRAINER,
  type Client,
} from './models-support';

const t = useTestApp();
let roles: RoleFixture;
let editor: Client;

beforeAll(async () => {
  roles = await createRoleFixture();
  editor = clientFor(t.app, t.config, roles.members.editor);
});

const revisionCount = (modelId: string) => Revision.count({ where: { modelId } });

describe('POST /api/models/:id/revisions', () => {
  it('saves on the latest base: number 2, parent revision 1, the content hash of the document, the findings', async () => {
    const { model, revision: first } = await createModelVia(editor, roles.workspace.id, {
      name: 'Meadowlark 40',
      yaml: TRAINER(),
    });
    const yaml = edit(TRAINER(), 'expo: 30,', 'expo: 35,');
    const response = await editor
      .post(`/api/models/${model.id}/revisions`, { base: 1, message: 'More aileron expo', yaml })
      .expect(201);
    const saved = response.body.data;
    expect(saved).toMatchObject({
      number: 2,
      parent_id: first.id,
      message: 'More aileron expo',
      origin: 'save',
      author: { id: roles.members.editor.id },
    });
    expect(saved.content_hash).toBe(contentHash(analyzeSetup(yaml).data));
    expect(saved.content_hash).not.toBe(first.content_hash);
    expect(saved.findings).toEqual(analyzeSetup(yaml).findings);
    expect(saved.error_count).toBe(0);
  });

  it('refuses a stale base with 409 stale-base naming the latest number, and stores nothing', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Stale base', yaml: TRAINER() });
    await saveVia(editor, model.id, 1, edit(TRAINER(), 'expo: 30,', 'expo: 31,'));
    await saveVia(editor, model.id, 2, edit(TRAINER(), 'expo: 30,', 'expo: 32,'));
    const response = await editor
      .post(`/api/models/${model.id}/revisions`, { base: 2, message: 'late', yaml: TRAINER() })
      .expect(409);
    expect(response.body.error).toMatchObject({ code: 'stale-base', details: { base: 2, latest: 3 } });
    expect(response.body.error.message).toMatch(/revision 3/);
    expect(await revisionCount(model.id)).toBe(3);
    // A base ahead of the history is not the latest either.
    await editor.post(`/api/models/${model.id}/revisions`, { base: 9, yaml: TRAINER() }).expect(409);
  });

  it('ten concurrent saves on one base: exactly one 201, nine 409, and the numbers stay gapless', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Race', yaml: TRAINER() });
    const texts = Array.from({ length: 10 }, (_, index) => edit(TRAINER(), 'expo: 30,', `expo: ${40 + index},`));
    const responses = await Promise.all(
      texts.map((yaml, index) =>
        editor.post(`/api/models/${model.id}/revisions`, { base: 1, message: `racer ${index}`, yaml }),
      ),
    );
    const statuses = responses.map((response) => response.status).sort();
    expect(statuses).toEqual([201, 409, 409, 409, 409, 409, 409, 409, 409, 409]);
    for (const response of responses.filter((r) => r.status === 409))
      expect(response.body.error.details.latest).toBe(2);

    const numbers = (await Revision.findAll({ where: { modelId: model.id }, order: [['number', 'ASC']] })).map(
      (revision) => revision.number,
    );
    expect(numbers).toEqual([1, 2]);
    const winner = responses.find((response) => response.status === 201)!.body.data;
    const stored = await Revision.findByPk(winner.id);
    expect(texts).toContain(stored!.yamlText);
    expect(stored!.message).toBe(`racer ${texts.indexOf(stored!.yamlText)}`);
  });

  it('ten concurrent saves, each retried on the latest base after a 409, all land with numbers 2-11', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Queue', yaml: TRAINER() });
    const saveUntilAccepted = async (index: number): Promise<number> => {
      for (let base = 1; ;) {
        const response = await editor.post(`/api/models/${model.id}/revisions`, {
          base,
          yaml: edit(TRAINER(), 'expo: 30,', `expo: ${50 + index},`),
        });
        if (response.status === 201) return response.body.data.number;
        expect(response.status).toBe(409);
        base = response.body.error.details.latest;
      }
    };
    const numbers = await Promise.all(Array.from({ length: 10 }, (_, index) => saveUntilAccepted(index)));
    expect([...numbers].sort((a, b) => a - b)).toEqual([2, 3, 4, 5, 6, 7, 8, 9, 10, 11]);
  });

  it.each([
    ['broken YAML', 'format: bindery-setup/1\nmodel: { name: Broken\nlink: [1,\n'],
    ['an alias bomb', ALIAS_BOMB],
    ['a list instead of a mapping', '- format: bindery-setup/1\n'],
    ['a duplicate key', 'format: bindery-setup/1\nformat: bindery-setup/1\n'],
  ])('refuses %s with 422 unreadable-setup and the syntax findings, storing nothing', async (_label, yaml) => {
    const { model } = await createModelVia(editor, roles.workspace.id, {
      name: `Unreadable ${_label}`,
      yaml: TRAINER(),
    });
    const events = await AuditEvent.count();
    const response = await editor
      .post(`/api/models/${model.id}/revisions`, { base: 1, message: 'bad', yaml })
      .expect(422);
    expect(response.body.error.code).toBe('unreadable-setup');
    const findings = response.body.error.details.findings;
    expect(findings.length).toBeGreaterThan(0);
    for (const finding of findings)
      expect(finding).toMatchObject({
        rule: 'syntax',
        severity: 'error',
        line: expect.any(Number),
        column: expect.any(Number),
      });
    expect(await revisionCount(model.id)).toBe(1);
    expect(await AuditEvent.count()).toBe(events);
  });

  it('gives the line and column of a syntax error', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Line and column', yaml: TRAINER() });
    const yaml = 'format: bindery-setup/1\nmodel: { name: Twice }\nformat: bindery-setup/1\n';
    const response = await editor.post(`/api/models/${model.id}/revisions`, { base: 1, yaml }).expect(422);
    expect(response.body.error.details.findings[0]).toMatchObject({ rule: 'syntax', line: 3, column: 1 });
    expect(response.body.error.message).toMatch(/line 3, column 1/);
  });

  it('saves a readable setup that has check errors, with its findings and counts', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Has errors', yaml: TRAINER() });
    const yaml = fixture('pairs/remap-second-receiver.before.yaml');
    const saved = (
      await editor
        .post(`/api/models/${model.id}/revisions`, { base: 1, message: 'wing receiver bound fresh', yaml })
        .expect(201)
    ).body.data;
    expect(saved.error_count).toBe(analyzeSetup(yaml).counts.errors);
    expect(saved.error_count).toBeGreaterThan(0);
    expect(saved.findings.map((finding: { rule: string }) => finding.rule)).toContain('function-unrouted');
    const stored = await Revision.findByPk(saved.id);
    expect(stored!.errorCount).toBe(saved.error_count);
  });

  it('keeps the airframe of the model in step with the latest readable setup', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Airframe', yaml: TRAINER() });
    expect(model.airframe).toBe('airplane');
    await saveVia(editor, model.id, 1, edit(TRAINER(), 'airframe: airplane', 'airframe: glider'));
    expect((await SetupModel.findByPk(model.id))!.airframe).toBe('glider');
  });

  it('refuses a setup over 512 KB with 413 and a NUL character with 422', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Limits', yaml: TRAINER() });
    const huge = `${TRAINER()}\n# ${'x'.repeat(530 * 1024)}\n`;
    expect(
      (await editor.post(`/api/models/${model.id}/revisions`, { base: 1, yaml: huge }).expect(413)).body.error.code,
    ).toBe('too-large');
    const nul = edit(TRAINER(), 'Meadowlark 40', 'Meadow\u0000lark');
    expect(
      (await editor.post(`/api/models/${model.id}/revisions`, { base: 1, yaml: nul }).expect(422)).body.error.code,
    ).toBe('unreadable-setup');
    expect(await revisionCount(model.id)).toBe(1);
  });

  it('answers a stranger 404 and a viewer 403 before judging the text, and stores nothing', async () => {
    // The save checks the text before its one statement checks the role, so a refused
    // text must still answer like the role check would.
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Roles first', yaml: TRAINER() });
    const stranger = clientFor(t.app, t.config, roles.outsider);
    const viewer = clientFor(t.app, t.config, roles.members.viewer);
    for (const yaml of [ALIAS_BOMB, TRAINER(), 'format: [unclosed']) {
      const asStranger = await stranger.post(`/api/models/${model.id}/revisions`, { base: 1, yaml }).expect(404);
      expect(asStranger.body.error.code).toBe('model-not-found');
      const asViewer = await viewer.post(`/api/models/${model.id}/revisions`, { base: 1, yaml }).expect(403);
      expect(asViewer.body.error).toMatchObject({
        code: 'role-too-low',
        details: { required: 'editor', role: 'viewer' },
      });
    }
    await editor.post('/api/models/not-a-uuid/revisions', { base: 1, yaml: 'format: [unclosed' }).expect(404);
    await editor
      .post('/api/models/00000000-0000-4000-8000-000000000000/revisions', { base: 1, yaml: TRAINER() })
      .expect(404);
    expect(await revisionCount(model.id)).toBe(1);
  });

  it('writes the audit entry of a save with the number it got', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Audited save', yaml: TRAINER() });
    const saved = await saveVia(editor, model.id, 1, edit(TRAINER(), 'expo: 30,', 'expo: 33,'));
    const entry = await AuditEvent.findOne({ where: { subjectId: saved.id } });
    expect(entry).toMatchObject({
      action: 'revision.saved',
      actorId: roles.members.editor.id,
      subjectType: 'revision',
    });
    expect(entry!.details).toEqual({ model_id: model.id, number: 2, content_hash: saved.content_hash, errors: 0 });
    const [stored] = await SetupModel.sequelize!.query<{ updated_at: Date; created_at: Date }>(
      'SELECT m.updated_at, r.created_at FROM models m JOIN revisions r ON r.model_id = m.id WHERE r.id = $id',
      { bind: { id: saved.id }, type: QueryTypes.SELECT },
    );
    expect(stored.updated_at.getTime()).toBe(stored.created_at.getTime());
  });

  it.each([
    ['no base', { yaml: 'x: 1' }, 'base'],
    ['a base of 0', { base: 0, yaml: 'x: 1' }, 'base'],
    ['a fractional base', { base: 1.5, yaml: 'x: 1' }, 'base'],
    ['a base as text', { base: '1', yaml: 'x: 1' }, 'base'],
    ['no yaml', { base: 1 }, 'yaml'],
    ['yaml that is not text', { base: 1, yaml: { format: 'bindery-setup/1' } }, 'yaml'],
    ['an unknown field', { base: 1, yaml: 'x: 1', force: true }, 'force'],
  ])('answers %s with 400 and a field error', async (_label, body, field) => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: `Input ${_label}`, yaml: TRAINER() });
    const response = await editor.post(`/api/models/${model.id}/revisions`, body).expect(400);
    expect(response.body.error.code).toBe('invalid-input');
    expect(response.body.error.details.fields).toHaveProperty(field);
    expect(await revisionCount(model.id)).toBe(1);
  });
});

describe('GET /api/models/:id/revisions (history)', () => {
  let modelId: string;
  beforeAll(async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'History', yaml: TRAINER() });
    modelId = model.id;
    for (let base = 1; base < 7; base += 1)
      await saveVia(editor, modelId, base, edit(TRAINER(), 'expo: 30,', `expo: ${30 + base},`), `step ${base + 1}`);
  });

  it('pages newest first with next_before until the first revision', async () => {
    const first = (await editor.get(`/api/models/${modelId}/revisions?limit=3`).expect(200)).body;
    expect(first.data.map((revision: { number: number }) => revision.number)).toEqual([7, 6, 5]);
    expect(first.pagination).toEqual({ limit: 3, before: null, next_before: 5 });
    const second = (await editor.get(`/api/models/${modelId}/revisions?limit=3&before=5`).expect(200)).body;
    expect(second.data.map((revision: { number: number }) => revision.number)).toEqual([4, 3, 2]);
    const last = (await editor.get(`/api/models/${modelId}/revisions?limit=3&before=2`).expect(200)).body;
    expect(last.data.map((revision: { number: number }) => revision.number)).toEqual([1]);
    expect(last.pagination.next_before).toBeNull();
  });

  it('gives each entry its summary without the text, and defaults to 50 per page', async () => {
    const body = (await editor.get(`/api/models/${modelId}/revisions`).expect(200)).body;
    expect(body.pagination).toMatchObject({ limit: 50, next_before: null });
    expect(body.data).toHaveLength(7);
    expect(body.data[0]).toMatchObject({
      number: 7,
      message: 'step 7',
      author: { id: roles.members.editor.id, name: 'The editor' },
      tags: [],
      error_count: 0,
    });
    expect(body.data[0]).not.toHaveProperty('yaml');
    expect(body.data[0].content_hash).toMatch(/^[0-9a-f]{64}$/);
  });

  it.each(['limit=0', 'limit=101', 'limit=abc', 'limit=2.5', 'before=0', 'before=x'])(
    'refuses %s with 400',
    async (query) => {
      const response = await editor.get(`/api/models/${modelId}/revisions?${query}`).expect(400);
      expect(response.body.error.code).toBe('invalid-input');
    },
  );
});

describe('GET /api/revisions/:id', () => {
  // Comments, odd spacing, CRLF line ends, a byte-order mark and non-ASCII text: all must come back as sent.
  const exotic = `\uFEFF${TRAINER().replace('name: Meadowlark 40', 'name: "Möwe 40 — Ørsted"   # trailing comment').replace(/\n/g, '\r\n')}`;

  it('answers the revision with yaml, document, findings, tags and author', async () => {
    const { model, revision } = await createModelVia(editor, roles.workspace.id, { name: 'Möwe 40', yaml: exotic });
    const body = (await editor.get(`/api/revisions/${revision.id}`).expect(200)).body.data;
    expect(body).toMatchObject({
      id: revision.id,
      number: 1,
      yaml: exotic,
      tags: [],
      author: { id: roles.members.editor.id },
      model: { id: model.id, name: 'Möwe 40' },
    });
    expect(body.document).toEqual(analyzeSetup(exotic).data);
    expect(body.findings).toEqual(analyzeSetup(exotic).findings);
  });

  it('answers ?format=yaml with the exact bytes as application/yaml, and ?download=1 as a named attachment', async () => {
    const { revision } = await createModelVia(editor, roles.workspace.id, { name: 'Möwe 40 / Ørsted?', yaml: exotic });
    const raw = await editor
      .get(`/api/revisions/${revision.id}?format=yaml`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(raw.status).toBe(200);
    expect(raw.headers['content-type']).toMatch(/^application\/yaml/);
    expect(Buffer.compare(raw.body as Buffer, Buffer.from(exotic, 'utf8'))).toBe(0);
    expect(raw.headers['content-disposition']).toBeUndefined();

    const download = await editor.get(`/api/revisions/${revision.id}?download=1`).expect(200);
    expect(download.headers['content-disposition']).toBe('attachment; filename=mowe-40-orsted-r1.yaml');
    expect(download.text).toBe(exotic);
  });

  it('also finds a revision by model and number', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'By number', yaml: TRAINER() });
    await saveVia(editor, model.id, 1, SCALE());
    const body = (await editor.get(`/api/models/${model.id}/revisions/2`).expect(200)).body.data;
    expect(body).toMatchObject({ number: 2, yaml: SCALE() });
    expect((await editor.get(`/api/models/${model.id}/revisions/2?format=yaml`).expect(200)).text).toBe(SCALE());
    await editor.get(`/api/models/${model.id}/revisions/3`).expect(404);
    await editor.get(`/api/models/${model.id}/revisions/two`).expect(404);
  });

  it('is 404 for an unknown id or one that is not a UUID, and 400 for an unknown format', async () => {
    const { revision } = await createModelVia(editor, roles.workspace.id, { name: 'Formats', yaml: TRAINER() });
    expect((await editor.get('/api/revisions/4b0f5d9e-5d1e-4c1b-9d2f-1a2b3c4d5e6f').expect(404)).body.error.code).toBe(
      'revision-not-found',
    );
    await editor.get('/api/revisions/12').expect(404);
    await editor.get(`/api/revisions/${revision.id}?format=toml`).expect(400);
  });
});

describe('POST /api/models/:id/revert', () => {
  it('makes a new revision with the old text and hash, recording which revision came back', async () => {
    const { model, revision: first } = await createModelVia(editor, roles.workspace.id, {
      name: 'Revert',
      yaml: TRAINER(),
    });
    await saveVia(editor, model.id, 1, edit(TRAINER(), 'expo: 30,', 'expo: 60,'));
    await saveVia(editor, model.id, 2, fixture('pairs/remap-second-receiver.before.yaml'));
    const reverted = (await editor.post(`/api/models/${model.id}/revert`, { number: 1, base: 3 }).expect(201)).body
      .data;
    expect(reverted).toMatchObject({
      number: 4,
      origin: 'revert',
      source_revision_id: first.id,
      content_hash: first.content_hash,
      message: 'Revert to revision 1',
      error_count: 0,
    });
    const stored = await Revision.findByPk(reverted.id);
    expect(stored!.yamlText).toBe(TRAINER());
    expect(await revisionCount(model.id)).toBe(4);
  });

  it('takes a message, refuses a stale base with 409 and an unknown number with 404', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Revert rules', yaml: TRAINER() });
    await saveVia(editor, model.id, 1, SCALE());
    expect(
      (
        await editor
          .post(`/api/models/${model.id}/revert`, { number: 1, base: 2, message: 'Back to the trainer' })
          .expect(201)
      ).body.data.message,
    ).toBe('Back to the trainer');
    expect(
      (await editor.post(`/api/models/${model.id}/revert`, { number: 1, base: 2 }).expect(409)).body.error,
    ).toMatchObject({ code: 'stale-base', details: { latest: 3 } });
    expect(
      (await editor.post(`/api/models/${model.id}/revert`, { number: 9, base: 3 }).expect(404)).body.error.code,
    ).toBe('revision-not-found');
    await editor.post(`/api/models/${model.id}/revert`, { base: 3 }).expect(400);
    expect(await revisionCount(model.id)).toBe(3);
  });
});

describe('tags', () => {
  it('adds, lists, refuses a name taken by another revision, and removes', async () => {
    const { model, revision: first } = await createModelVia(editor, roles.workspace.id, {
      name: 'Tagged',
      yaml: TRAINER(),
    });
    const second = await saveVia(editor, model.id, 1, SCALE());
    const added = await editor.post(`/api/revisions/${first.id}/tags`, { name: 'maiden' }).expect(201);
    expect(added.body.data).toEqual({ revision_id: first.id, number: 1, tags: ['maiden'] });
    await editor.post(`/api/revisions/${first.id}/tags`, { name: 'season-2026' }).expect(201);
    expect(
      (await editor.post(`/api/revisions/${first.id}/tags`, { name: 'maiden' }).expect(200)).body.data.tags,
    ).toEqual(['maiden', 'season-2026']);

    const taken = await editor.post(`/api/revisions/${second.id}/tags`, { name: 'maiden' }).expect(409);
    expect(taken.body.error).toMatchObject({ code: 'tag-taken', details: { name: 'maiden', number: 1 } });

    const history = (await editor.get(`/api/models/${model.id}/revisions`).expect(200)).body.data;
    expect(history.find((revision: { number: number }) => revision.number === 1).tags).toEqual([
      'maiden',
      'season-2026',
    ]);
    expect((await editor.get(`/api/revisions/${first.id}`).expect(200)).body.data.tags).toEqual([
      'maiden',
      'season-2026',
    ]);

    expect((await editor.delete(`/api/revisions/${first.id}/tags/maiden`).expect(200)).body.data.tags).toEqual([
      'season-2026',
    ]);
    expect((await editor.delete(`/api/revisions/${first.id}/tags/maiden`).expect(404)).body.error.code).toBe(
      'tag-not-found',
    );
    await editor.post(`/api/revisions/${second.id}/tags`, { name: 'maiden' }).expect(201);
  });

  it.each(['', 'Season 2026', 'x'.repeat(41), '-leading', 'ünïcode', 'a/b'])(
    'refuses the tag name %j with 400',
    async (name) => {
      const { revision } = await createModelVia(editor, roles.workspace.id, { name: 'Tag names', yaml: TRAINER() });
      expect((await editor.post(`/api/revisions/${revision.id}/tags`, { name }).expect(400)).body.error.code).toBe(
        'invalid-input',
      );
    },
  );

  it('lets the same name stand on revisions of two different models', async () => {
    const one = await createModelVia(editor, roles.workspace.id, { name: 'One', yaml: TRAINER() });
    const two = await createModelVia(editor, roles.workspace.id, { name: 'Two', yaml: TRAINER() });
    await editor.post(`/api/revisions/${one.revision.id}/tags`, { name: 'season-2025' }).expect(201);
    await editor.post(`/api/revisions/${two.revision.id}/tags`, { name: 'season-2025' }).expect(201);
  });
});

describe('the database keeps history immutable', () => {
  it('refuses a direct SQL UPDATE, DELETE and TRUNCATE of revisions', async () => {
    const { revision } = await createModelVia(editor, roles.workspace.id, { name: 'Immutable', yaml: TRAINER() });
    await expect(
      t.sequelize.query(`UPDATE revisions SET message = 'rewritten' WHERE id = $1`, { bind: [revision.id] }),
    ).rejects.toThrow(/revisions are immutable: UPDATE/);
    await expect(
      t.sequelize.query(`UPDATE revisions SET yaml_text = '' WHERE id = $1`, { bind: [revision.id] }),
    ).rejects.toThrow(/immutable/);
    await expect(t.sequelize.query(`DELETE FROM revisions WHERE id = $1`, { bind: [revision.id] })).rejects.toThrow(
      /revisions are immutable: DELETE/,
    );
    await expect(t.sequelize.query('TRUNCATE revisions CASCADE')).rejects.toThrow(/revisions are immutable: TRUNCATE/);
    const [row] = await t.sequelize.query<{ message: string }>('SELECT message FROM revisions WHERE id = $1', {
      bind: [revision.id],
      type: QueryTypes.SELECT,
    });
    expect(row.message).toBe('First revision');
  });

  it('refuses an insert that would leave a gap or name the wrong parent', async () => {
    const { model, revision } = await createModelVia(editor, roles.workspace.id, { name: 'Gapless', yaml: TRAINER() });
    const insert = (number: number, parent: string | null) =>
      t.sequelize.query(
        `INSERT INTO revisions (model_id, number, parent_id, author_id, yaml_text, document, content_hash)
         VALUES ($1, $2, $3, $4, 'x: 1', '{}', repeat('a', 64))`,
        { bind: [model.id, number, parent, roles.members.editor.id] },
      );
    await expect(insert(3, revision.id)).rejects.toThrow(/breaks the sequence/);
    await expect(insert(2, null)).rejects.toThrow();
    await expect(insert(1, null)).rejects.toThrow();
    await insert(2, revision.id);
    expect(await revisionCount(model.id)).toBe(2);
  });
});
