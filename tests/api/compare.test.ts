import { applyPatch, deepClone } from 'fast-json-patch';
import { QueryTypes } from 'sequelize';
import { beforeAll, describe, expect, it } from 'vitest';
import { analyzeSetup } from '@shared/analyze';
import { COMPARE_FORMAT_VERSION, compareRevisions, textDiff } from '@shared/diff';
import { createRoleFixture, type RoleFixture } from './helpers/factories';
import { useTestApp } from './helpers/test-app';
import { clientFor, createModelVia, edit, fixture, SCALE, saveVia, TRAINER, type Client } from './models-support';

const t = useTestApp();
let roles: RoleFixture;
let editor: Client;
let viewer: Client;
let before: { id: string };
let after: { id: string };
let modelId: string;

beforeAll(async () => {
  roles = await createRoleFixture();
  editor = clientFor(t.app, t.config, roles.members.editor);
  viewer = clientFor(t.app, t.config, roles.members.viewer);
  const created = await createModelVia(editor, roles.workspace.id, {
    name: 'Kestrel Mk II',
    yaml: fixture('pairs/failsafe-fix.before.yaml'),
  });
  modelId = created.model.id;
  before = created.revision;
  after = await saveVia(
    editor,
    modelId,
    1,
    fixture('pairs/failsafe-fix.after.yaml'),
    'Wing pin 3 failsafe 988 -> 1500',
  );
});

describe('GET /api/compare', () => {
  it('answers the change list, counts, sections, findings delta and outputs delta for two revisions of one model', async () => {
    const body = (await viewer.get(`/api/compare?from=${before.id}&to=${after.id}`).expect(200)).body.data;
    expect(Object.keys(body).sort()).toEqual(
      ['change_findings', 'changes', 'counts', 'findings_delta', 'from', 'outputs_delta', 'sections', 'to'].sort(),
    );
    expect(body.from).toMatchObject({ id: before.id, number: 1, model: { id: modelId, name: 'Kestrel Mk II' } });
    expect(body.to).toMatchObject({ id: after.id, number: 2, message: 'Wing pin 3 failsafe 988 -> 1500' });

    expect(body.changes).toHaveLength(1);
    expect(body.changes[0]).toMatchObject({
      kind: 'changed',
      section: 'receivers',
      path: 'receivers[id=wing].map[pin=3].failsafe',
      before: 988,
      after: 1500,
    });
    expect(body.changes[0].summary).toMatch(/988.*1500/);
    expect(body.counts).toEqual({ added: 0, removed: 0, changed: 1, renamed: 0, moved: 0 });
    expect(body.sections.receivers.changed).toBe(1);
    expect(body.sections.channels).toEqual({ added: 0, removed: 0, changed: 0, renamed: 0, moved: 0 });

    expect(body.findings_delta.introduced).toEqual([]);
    expect(body.findings_delta.resolved.map((finding: { rule: string }) => finding.rule)).toEqual(['failsafe-endstop']);
    expect(Array.isArray(body.outputs_delta)).toBe(true);
  });

  it('sends the YAML text diff from its own route, only when asked', async () => {
    const text = (await viewer.get(`/api/compare/text?from=${before.id}&to=${after.id}`).expect(200)).body.data;
    expect(text).toEqual(textDiff(fixture('pairs/failsafe-fix.before.yaml'), fixture('pairs/failsafe-fix.after.yaml')));
    expect(text.removed).toBeGreaterThan(0);
    expect(text.rows.some((row: { kind: string }) => row.kind === 'changed')).toBe(true);
    const outsider = clientFor(t.app, t.config, roles.outsider);
    await outsider.get(`/api/compare/text?from=${before.id}&to=${after.id}`).expect(404);
  });

  it('compresses the answers for a client that accepts gzip', async () => {
    const response = await viewer
      .get(`/api/compare/text?from=${before.id}&to=${after.id}`)
      .set('Accept-Encoding', 'gzip')
      .expect(200);
    expect(response.headers['content-encoding']).toBe('gzip');
    expect(response.body.data.rows.length).toBeGreaterThan(0);
  });

  it('compares revisions of two models, each side read-checked', async () => {
    const trainer = await createModelVia(editor, roles.workspace.id, { name: 'Meadowlark 40', yaml: TRAINER() });
    const body = (await viewer.get(`/api/compare?from=${trainer.revision.id}&to=${after.id}`).expect(200)).body.data;
    expect(body.from.model.id).toBe(trainer.model.id);
    expect(body.to.model.id).toBe(modelId);
    expect(body.counts.added).toBeGreaterThan(0);
    expect(body.sections.receivers.added).toBeGreaterThan(0);

    const outsider = clientFor(t.app, t.config, roles.outsider);
    const theirs = await createModelVia(outsider, roles.otherWorkspace.id, { name: 'Theirs', yaml: SCALE() });
    expect(
      (await viewer.get(`/api/compare?from=${theirs.revision.id}&to=${after.id}`).expect(404)).body.error.code,
    ).toBe('revision-not-found');
    expect(
      (await outsider.get(`/api/compare?from=${theirs.revision.id}&to=${after.id}`).expect(404)).body.error.code,
    ).toBe('revision-not-found');
  });

  it('presents each side as the revision and model routes present them, tags and author included', async () => {
    await editor.post(`/api/revisions/${after.id}/tags`).send({ name: 'maiden-flight' }).expect(201);
    await editor.post(`/api/revisions/${after.id}/tags`).send({ name: 'field-ready' }).expect(201);
    const body = (await viewer.get(`/api/compare?from=${before.id}&to=${after.id}`).expect(200)).body.data;
    const model = (await viewer.get(`/api/models/${modelId}`).expect(200)).body.data;
    for (const [side, id] of [
      [body.from, before.id],
      [body.to, after.id],
    ] as const) {
      const { model: sideModel, ...summary } = side;
      expect(Object.keys(summary)).toEqual([
        'id',
        'model_id',
        'number',
        'parent_id',
        'author',
        'message',
        'content_hash',
        'error_count',
        'warning_count',
        'info_count',
        'origin',
        'source_revision_id',
        'tags',
        'created_at',
      ]);
      const revision = (await viewer.get(`/api/revisions/${id}`).expect(200)).body.data;
      expect(summary).toEqual(Object.fromEntries(Object.keys(summary).map((key) => [key, revision[key]])));
      expect(sideModel).toEqual({ id: model.id, name: model.name, workspace_id: roles.workspace.id });
    }
    expect(body.to.tags).toEqual(['field-ready', 'maiden-flight']);
    expect(body.to.author).toEqual({ id: roles.members.editor.id, name: roles.members.editor.name });
  });

  it('answers 404 revision-not-found for a bad id, a missing revision or a stranger, on either side and either route', async () => {
    const outsider = clientFor(t.app, t.config, roles.outsider);
    const missing = '6f1c2a4e-0b7d-4c3e-9a51-2d8e7f604b19';
    for (const route of ['/api/compare', '/api/compare/text']) {
      for (const [client, from, to] of [
        [viewer, 'nope', after.id],
        [viewer, before.id, `${after.id}x`],
        [viewer, missing, after.id],
        [viewer, before.id, missing],
        [outsider, before.id, after.id],
      ] as const) {
        const refused = await client.get(`${route}?from=${from}&to=${to}`).expect(404);
        expect(refused.body.error).toMatchObject({ code: 'revision-not-found', message: 'No such revision.' });
      }
    }
  });

  it('compares a revision with itself as no change', async () => {
    const body = (await viewer.get(`/api/compare?from=${after.id}&to=${after.id}`).expect(200)).body.data;
    expect(body.changes).toEqual([]);
    expect(body.findings_delta).toEqual({ introduced: [], resolved: [], accepted: [] });
  });

  it('needs both ids: 400 when one is missing, 404 when one is not a revision', async () => {
    expect((await viewer.get(`/api/compare?from=${before.id}`).expect(400)).body.error.details.fields).toHaveProperty(
      'to',
    );
    await viewer.get(`/api/compare?from=${before.id}&to=nope`).expect(404);
  });

  it('answers null outputs_delta when one side is not a valid setup', async () => {
    const broken = await saveVia(
      editor,
      modelId,
      2,
      'format: bindery-setup/1\nmodel: { name: Half }\n',
      'half-written',
    );
    const body = (await viewer.get(`/api/compare?from=${after.id}&to=${broken.id}`).expect(200)).body.data;
    expect(body.outputs_delta).toBeNull();
    expect(body.findings_delta.introduced.some((finding: { rule: string }) => finding.rule === 'schema')).toBe(true);
  });
});

describe('the compare cache', () => {
  const cached = (fromHash: string, toHash: string) =>
    t.sequelize.query<{ result: string; format_version: number }>(
      'SELECT result, format_version FROM compare_cache WHERE from_hash = $fromHash AND to_hash = $toHash',
      { bind: { fromHash, toHash }, type: QueryTypes.SELECT },
    );

  it('answers from the cache exactly what a fresh compute gives, keyed by both content hashes and the format version', async () => {
    const yamlBefore = fixture('pairs/failsafe-fix.before.yaml');
    const yamlAfter = fixture('pairs/failsafe-fix.after.yaml');
    const { model, revision } = await createModelVia(editor, roles.workspace.id, { name: 'Cache', yaml: yamlBefore });
    const saved = await saveVia(editor, model.id, 1, yamlAfter);
    // The first describe compared the same two documents (in another model): the row is
    // shared by content; it is removed so this compare computes afresh.
    await t.sequelize.query('DELETE FROM compare_cache WHERE from_hash = $fromHash AND to_hash = $toHash', {
      bind: { fromHash: revision.content_hash, toHash: saved.content_hash },
    });

    const first = (await viewer.get(`/api/compare?from=${revision.id}&to=${saved.id}`).expect(200)).body.data;
    const rows = await cached(revision.content_hash, saved.content_hash);
    expect(rows.map((row) => row.format_version)).toEqual([COMPARE_FORMAT_VERSION]);
    const second = (await viewer.get(`/api/compare?from=${revision.id}&to=${saved.id}`).expect(200)).body.data;
    expect(second).toEqual(first);

    const beforeAnalysis = analyzeSetup(yamlBefore);
    const afterAnalysis = analyzeSetup(yamlAfter);
    const fresh = compareRevisions(
      { text: yamlBefore, data: beforeAnalysis.data, findings: beforeAnalysis.findings },
      { text: yamlAfter, data: afterAnalysis.data, findings: afterAnalysis.findings },
    );
    const { text: _text, ...withoutText } = fresh;
    const { from: _from, to: _to, ...answered } = second;
    expect(answered).toEqual(JSON.parse(JSON.stringify(withoutText)));
  });

  it('is what the answer is built from: a row in the table is served as it stands', async () => {
    const { model, revision } = await createModelVia(editor, roles.workspace.id, { name: 'Planted', yaml: TRAINER() });
    const saved = await saveVia(editor, model.id, 1, edit(TRAINER(), 'expo: 30,', 'expo: 45,'));
    // A planted row with a marker proves the route reads the table rather than recomputing.
    await t.sequelize.query(
      'INSERT INTO compare_cache (from_hash, to_hash, format_version, result) VALUES ($fromHash, $toHash, $version, $result)',
      {
        bind: {
          fromHash: revision.content_hash,
          toHash: saved.content_hash,
          version: COMPARE_FORMAT_VERSION,
          result: JSON.stringify({ changes: [], counts: { planted: 1 }, sections: {}, outputs_delta: null }),
        },
      },
    );
    const body = (await viewer.get(`/api/compare?from=${revision.id}&to=${saved.id}`).expect(200)).body.data;
    expect(body.counts).toEqual({ planted: 1 });
    // A row of another format version is never served.
    await t.sequelize.query('UPDATE compare_cache SET format_version = format_version - 1 WHERE to_hash = $toHash', {
      bind: { toHash: saved.content_hash },
    });
    const fresh = (await viewer.get(`/api/compare?from=${revision.id}&to=${saved.id}`).expect(200)).body.data;
    expect(fresh.counts.changed).toBe(1);
  });

  it('is shared by two app instances on one database', async () => {
    const yaml = edit(TRAINER(), 'expo: 30,', 'expo: 47,');
    const { model, revision } = await createModelVia(editor, roles.workspace.id, { name: 'Shared', yaml: TRAINER() });
    const saved = await saveVia(editor, model.id, 1, yaml);
    const other = t.appWith({});
    const otherViewer = clientFor(other.app, other.config, roles.members.viewer);
    const fromOther = (await otherViewer.get(`/api/compare?from=${revision.id}&to=${saved.id}`).expect(200)).body.data;
    const [row] = await cached(revision.content_hash, saved.content_hash);
    expect(JSON.parse(row.result).counts).toEqual(fromOther.counts);
    await t.sequelize.query(
      "UPDATE compare_cache SET result = jsonb_set(result::jsonb, '{counts,moved}', '99')::text WHERE to_hash = $toHash",
      { bind: { toHash: saved.content_hash } },
    );
    const fromThis = (await viewer.get(`/api/compare?from=${revision.id}&to=${saved.id}`).expect(200)).body.data;
    expect(fromThis.counts.moved).toBe(99);
  });
});

describe('GET /api/compare sees every change in behaviour (second edition)', () => {
  let demo: string;
  let base: { id: string };

  beforeAll(async () => {
    const created = await createModelVia(editor, roles.workspace.id, { name: 'Kestrel behaviour', yaml: SCALE() });
    demo = created.model.id;
    base = created.revision;
  });

  it('reports what moves differently when only the elevator expo changed (15 -> 20)', async () => {
    const expo = await saveVia(editor, demo, 1, edit(SCALE(), 'weight: 92, expo: 15', 'weight: 92, expo: 20'), 'Expo');
    const body = (await viewer.get(`/api/compare?from=${base.id}&to=${expo.id}`).expect(200)).body.data;
    // Fuselage pin 2 (elevator, default travel [arduino-servo]), stick at -50 %, flaps up:
    // [expo-cubic] 92 * (0.85 * -0.5 + 0.15 * -0.125) = -40.825 % -> 1500 - 204.125 = 1295.9 -> 1296 µs;
    // 92 * (0.8 * -0.5 + 0.2 * -0.125) = -39.1 % -> 1500 - 195.5 = 1304.5 -> 1305 µs.
    expect(body.outputs_delta[0]).toMatchObject({
      kind: 'pulse',
      receiver: 'fuselage',
      pin: 2,
      position: { set: { 'elevator-stick': -50, 'flap-switch': 0 }, lost: [] },
      before_us: 1296,
      after_us: 1305,
    });
    expect(body.outputs_delta.every((row: { pin: number }) => row.pin === 2)).toBe(true);
    expect(body.change_findings).toEqual([]);
  });

  it('reports what moves differently when only the low aileron rate changed (60 -> 65)', async () => {
    const rates = await saveVia(
      editor,
      demo,
      2,
      SCALE().replaceAll('weights: [100, 60]', 'weights: [100, 65]'),
      'Rates',
    );
    const body = (await viewer.get(`/api/compare?from=${base.id}&to=${rates.id}`).expect(200)).body.data;
    // Low rate at full left stick: 1500 - 0.60 * 500 = 1200 µs before, 1500 - 0.65 * 500 = 1175 µs after on
    // pin 1; pin 6 is reversed, so 1800 -> 1825 µs.
    expect(
      body.outputs_delta.map((row: { pin: number; before_us: number; after_us: number; position: { set: object } }) => [
        row.pin,
        row.position.set,
        row.before_us,
        row.after_us,
      ]),
    ).toEqual([
      [1, { 'rate-switch': 1, 'aileron-stick': -100 }, 1200, 1175],
      [6, { 'rate-switch': 1, 'aileron-stick': -100 }, 1800, 1825],
    ]);
  });

  it('warns in change_findings when a channel is reversed but its failsafe number stays', async () => {
    const reversed = await saveVia(
      editor,
      demo,
      3,
      edit(
        SCALE(),
        'function: motor,         role: throttle,',
        'function: motor,         role: throttle, travel: { reverse: true },',
      ),
      'Reverse the motor channel',
    );
    const body = (await viewer.get(`/api/compare?from=${base.id}&to=${reversed.id}`).expect(200)).body.data;
    // Fuselage pin 3 keeps 1000 µs: through the old travel -100 % (stopped), through the
    // reversed one +100 % (full power).
    expect(body.change_findings).toMatchObject([
      { rule: 'failsafe-meaning-changed', severity: 'warning', path: 'receivers[id=fuselage].map[pin=3].failsafe' },
    ]);
    expect(body.change_findings[0].message).toContain('-100 % of travel and now means 100 %');
  });
});

describe('GET /api/revisions/:id/patch', () => {
  it('answers the RFC 6902 patch that turns the old document into the new one', async () => {
    const trainer = await createModelVia(editor, roles.workspace.id, { name: 'Patch', yaml: TRAINER() });
    const edited = edit(edit(TRAINER(), 'expo: 30,', 'expo: 45,'), 'weight_g: 2400', 'weight_g: 2550');
    const second = await saveVia(editor, trainer.model.id, 1, edited);
    const [from, to, patch] = await Promise.all([
      viewer.get(`/api/revisions/${trainer.revision.id}`).expect(200),
      viewer.get(`/api/revisions/${second.id}`).expect(200),
      viewer.get(`/api/revisions/${second.id}/patch?from=${trainer.revision.id}`).expect(200),
    ]);
    const operations = patch.body.data;
    expect(operations.length).toBeGreaterThan(0);
    // [rfc-6902] applying the patch to the old document gives the new one (fast-json-patch as the reference).
    const result = applyPatch(deepClone(from.body.data.document), operations, true, false).newDocument;
    expect(result).toEqual(to.body.data.document);
  });

  it('offers the patch as a file, and is 404 across workspaces', async () => {
    const download = await viewer.get(`/api/revisions/${after.id}/patch?from=${before.id}&download=1`).expect(200);
    expect(download.headers['content-type']).toMatch(/^application\/json-patch\+json/);
    expect(download.headers['content-disposition']).toBe('attachment; filename=kestrel-mk-ii-r1-to-r2.patch.json');
    expect(JSON.parse(download.text)).toEqual([
      { op: 'replace', path: expect.stringMatching(/^\/receivers\/1\/map\/2\/failsafe$/), value: 1500 },
    ]);
    const outsider = clientFor(t.app, t.config, roles.outsider);
    await outsider.get(`/api/revisions/${after.id}/patch?from=${before.id}`).expect(404);
    await viewer.get(`/api/revisions/${after.id}/patch`).expect(400);
  });
});
