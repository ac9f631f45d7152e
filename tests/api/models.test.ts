import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { analyzeSetup } from '@shared/analyze';
import { AuditEvent, Revision, SetupModel, Workspace } from '@api/models';
import { starterSetup } from '@api/starter-setup';
import { addMember, createRoleFixture, createUser, createWorkspace, type RoleFixture } from './helpers/factories';
import { useTestApp } from './helpers/test-app';
import {
  clientFor,
  createModelVia,
  edit,
  fixture,
  GLIDER,
  SCALE,
  saveVia,
  TRAINER,
  type Client,
} from './models-support';

const t = useTestApp();
let roles: RoleFixture;
let owner: Client;
let editor: Client;

beforeAll(async () => {
  roles = await createRoleFixture();
  owner = clientFor(t.app, t.config, roles.members.owner);
  editor = clientFor(t.app, t.config, roles.members.editor);
});

describe('POST /api/workspaces/:ws/models', () => {
  it('starts a model from the starter setup when no YAML is given: a clean single-receiver setup named after the model', async () => {
    const response = await editor
      .post(`/api/workspaces/${roles.workspace.id}/models`, { name: '  Tern 1800 ' })
      .expect(201);
    const { model, revision } = response.body.data;
    expect(model).toMatchObject({
      name: 'Tern 1800',
      workspace_id: roles.workspace.id,
      airframe: 'airplane',
      forked_from_revision_id: null,
      forked_from: null,
      review_state: 'none',
      cleared_for_maiden: false,
      role: 'editor',
      latest: { id: revision.id, number: 1, error_count: 0, warning_count: 0 },
    });
    expect(revision).toMatchObject({
      number: 1,
      parent_id: null,
      origin: 'create',
      findings: [],
      error_count: 0,
      warning_count: 0,
      info_count: 0,
    });
    const stored = await Revision.findByPk(revision.id);
    expect(stored!.yamlText).toBe(starterSetup('Tern 1800'));
    expect((stored!.document as { model: { name: string } }).model.name).toBe('Tern 1800');
  });

  it('the starter setup takes a chosen airframe and passes every check for awkward names too', async () => {
    for (const name of ['yes', '12', 'Kite: "mk 2" # test', "O'Shea's - glider"]) {
      const analysis = analyzeSetup(starterSetup(name, 'glider'));
      expect(analysis.findings).toEqual([]);
      expect(analysis.data).toMatchObject({ model: { name, airframe: 'glider' } });
    }
    const { model } = (
      await editor
        .post(`/api/workspaces/${roles.workspace.id}/models`, { name: 'Slope soarer', airframe: 'glider' })
        .expect(201)
    ).body.data;
    expect(model.airframe).toBe('glider');
  });

  it('keeps given YAML exactly as sent and takes the airframe from it', async () => {
    const yaml = GLIDER();
    const { model, revision } = await createModelVia(editor, roles.workspace.id, {
      name: 'Club glider',
      yaml,
      message: 'From the club sheet',
    });
    expect(model.airframe).toBe('glider');
    expect(revision).toMatchObject({ message: 'From the club sheet', origin: 'create' });
    expect((await Revision.findByPk(revision.id))!.yamlText).toBe(yaml);
  });

  it('refuses unreadable YAML with 422 and creates no model', async () => {
    const before = await SetupModel.count();
    const response = await editor
      .post(`/api/workspaces/${roles.workspace.id}/models`, { name: 'Nope', yaml: 'model: [unclosed\n' })
      .expect(422);
    expect(response.body.error.code).toBe('unreadable-setup');
    expect(await SetupModel.count()).toBe(before);
  });

  it.each([
    ['no name', {}, 'name'],
    ['an empty name', { name: '   ' }, 'name'],
    ['a name of 81 characters', { name: 'x'.repeat(81) }, 'name'],
    ['a name with a line break', { name: 'Two\nlines' }, 'name'],
    ['an unknown airframe', { name: 'A', airframe: 'zeppelin' }, 'airframe'],
    ['an unknown field', { name: 'A', colour: 'red' }, 'colour'],
  ])('refuses %s with 400', async (_label, body, field) => {
    const response = await editor.post(`/api/workspaces/${roles.workspace.id}/models`, body).expect(400);
    expect(response.body.error.details.fields).toHaveProperty(field);
  });
});

describe('GET /api/workspaces/:ws/models (the hangar)', () => {
  let workspaceId: string;
  let hangarOwner: Client;
  beforeAll(async () => {
    const user = await createUser({ name: 'Hangar keeper' });
    workspaceId = (await createWorkspace({ name: 'Hangar test', owner: user })).id;
    hangarOwner = clientFor(t.app, t.config, user);
    const scale = await createModelVia(hangarOwner, workspaceId, { name: 'Kestrel Mk II', yaml: SCALE() });
    await saveVia(
      hangarOwner,
      scale.model.id,
      1,
      // The model keeps its name: this save is about the receivers.
      edit(fixture('pairs/remap-second-receiver.before.yaml'), 'name: Kestrel Twin', 'name: Kestrel Mk II'),
      'Wing receiver bound',
    );
    await createModelVia(hangarOwner, workspaceId, { name: 'meadowlark 40', yaml: TRAINER() });
    await createModelVia(hangarOwner, workspaceId, { name: 'Sedge 3.4', yaml: GLIDER() });
    await createModelVia(hangarOwner, workspaceId, { name: '100% scale_cub', yaml: TRAINER() });
  });

  it("lists the workspace's models by name with each one's latest revision and review state", async () => {
    const body = (await hangarOwner.get(`/api/workspaces/${workspaceId}/models`).expect(200)).body;
    expect(body.data.map((model: { name: string }) => model.name)).toEqual([
      '100% scale_cub',
      'Kestrel Mk II',
      'meadowlark 40',
      'Sedge 3.4',
    ]);
    expect(body.pagination).toEqual({ limit: 100, offset: 0, total: 4, next_after: null, archived: 0 });
    const kestrel = body.data[1];
    const { counts } = analyzeSetup(fixture('pairs/remap-second-receiver.before.yaml'));
    expect(kestrel.latest).toMatchObject({
      number: 2,
      error_count: counts.errors,
      warning_count: counts.warnings,
      message: 'Wing receiver bound',
      author: { name: 'Hangar keeper' },
    });
    expect(kestrel.latest.created_at).toEqual(expect.any(String));
    for (const model of body.data)
      expect(model).toMatchObject({ review_state: 'none', cleared_for_maiden: false, role: 'owner' });
  });

  it('searches names and airframes with ?q=, case-insensitively, treating % and _ literally', async () => {
    const names = async (q: string) =>
      (
        await hangarOwner.get(`/api/workspaces/${workspaceId}/models?q=${encodeURIComponent(q)}`).expect(200)
      ).body.data.map((model: { name: string }) => model.name);
    expect(await names('MEADOW')).toEqual(['meadowlark 40']);
    expect(await names('glider')).toEqual(['Sedge 3.4']);
    expect(await names('%')).toEqual(['100% scale_cub']);
    expect(await names('_')).toEqual(['100% scale_cub']);
    expect(await names('nothing like it')).toEqual([]);
  });

  it('pages with limit and offset, and refuses bad paging', async () => {
    const body = (await hangarOwner.get(`/api/workspaces/${workspaceId}/models?limit=2&offset=2`).expect(200)).body;
    expect(body.data.map((model: { name: string }) => model.name)).toEqual(['meadowlark 40', 'Sedge 3.4']);
    expect(body.pagination).toEqual({ limit: 2, offset: 2, total: 4, next_after: null, archived: 0 });
    // Keyset paging: the first page's next_after starts the same second page.
    const first = (await hangarOwner.get(`/api/workspaces/${workspaceId}/models?limit=2`).expect(200)).body;
    expect(first.pagination.next_after).toBe(first.data[1].id);
    const second = (
      await hangarOwner
        .get(`/api/workspaces/${workspaceId}/models?limit=2&after=${first.pagination.next_after}`)
        .expect(200)
    ).body;
    expect(second.data.map((model: { name: string }) => model.name)).toEqual(['meadowlark 40', 'Sedge 3.4']);
    expect(second.pagination.next_after).toBeNull();
    await hangarOwner.get(`/api/workspaces/${workspaceId}/models?after=not-an-id`).expect(400);
    await hangarOwner.get(`/api/workspaces/${workspaceId}/models?limit=0`).expect(400);
    await hangarOwner.get(`/api/workspaces/${workspaceId}/models?q=${'x'.repeat(101)}`).expect(400);
  });

  it('shows an empty hangar as an empty list', async () => {
    const user = await createUser();
    const empty = await createWorkspace({ owner: user });
    expect((await clientFor(t.app, t.config, user).get(`/api/workspaces/${empty.id}/models`).expect(200)).body).toEqual(
      { data: [], pagination: { limit: 100, offset: 0, total: 0, archived: 0, next_after: null } },
    );
  });
});

describe('GET and PATCH /api/models/:id', () => {
  it('answers the model with its latest revision, review state and maiden clearance', async () => {
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Detail', yaml: TRAINER() });
    const second = await saveVia(editor, model.id, 1, edit(TRAINER(), 'expo: 30,', 'expo: 20,'));
    const viewer = clientFor(t.app, t.config, roles.members.viewer);
    const body = (await viewer.get(`/api/models/${model.id}`).expect(200)).body.data;
    expect(body).toMatchObject({
      id: model.id,
      name: 'Detail',
      latest: { id: second.id, number: 2 },
      review_state: 'none',
      cleared_for_maiden: false,
      forked_from: null,
      role: 'viewer',
    });
  });

  it('renames the model (editor) and keeps model.name in step: a new revision with the one line changed, audited', async () => {
    const { model, revision } = await createModelVia(editor, roles.workspace.id, { name: 'Old name', yaml: TRAINER() });
    const response = (await editor.patch(`/api/models/${model.id}`, { name: 'New name' }).expect(200)).body;
    expect(response.data).toMatchObject({ id: model.id, name: 'New name', latest: { number: 2 } });
    expect(response.revision).toMatchObject({ number: 2, origin: 'save' });
    expect((await Revision.findByPk(revision.id))!.yamlText).toBe(TRAINER());
    const second = (await Revision.findOne({ where: { modelId: model.id, number: 2 } }))!;
    const before = (analyzeSetup(TRAINER()).data as { model: { name: string } }).model.name;
    // Only the name's line changed; comments and layout elsewhere are as written.
    expect(second.yamlText).toBe(TRAINER().replace(`name: ${before}`, 'name: New name'));
    expect((second.document as { model: { name: string } }).model.name).toBe('New name');
    const event = await AuditEvent.findOne({ where: { subjectId: model.id, action: 'model.renamed' } });
    expect(event!.details).toMatchObject({ from: 'Old name', to: 'New name', number: 2 });
    await editor.patch(`/api/models/${model.id}`, { name: '' }).expect(400);
    await editor.patch(`/api/models/${model.id}`, { name: 'Fine', airframe: 'boat' }).expect(400);
  });

  it('is 404 for an unknown id and for a model of a workspace the caller is not in', async () => {
    expect((await editor.get(`/api/models/${randomUUID()}`).expect(404)).body.error.code).toBe('model-not-found');
    await editor.get('/api/models/not-an-id').expect(404);
    const outsider = clientFor(t.app, t.config, roles.outsider);
    const theirs = await createModelVia(outsider, roles.otherWorkspace.id, { name: 'Not yours' });
    expect((await editor.get(`/api/models/${theirs.model.id}`).expect(404)).body.error.code).toBe('model-not-found');
  });
});

describe('POST /api/models/:id/fork', () => {
  let source: Awaited<ReturnType<typeof createModelVia>>;
  let clubmate: Client;
  let clubWorkspaceId: string;
  beforeAll(async () => {
    source = await createModelVia(editor, roles.workspace.id, { name: 'Sedge 3.4', yaml: GLIDER() });
    await saveVia(
      editor,
      source.model.id,
      1,
      edit(GLIDER(), 'weight: 70, expo: 30 }', 'weight: 75, expo: 30 }'),
      'More aileron',
    );
    // A club-mate who reads this workspace and edits one of their own.
    const user = await createUser({ name: 'Club-mate' });
    await addMember(roles.workspace, user, 'viewer');
    clubWorkspaceId = (await createWorkspace({ name: "Club-mate's hangar", owner: user })).id;
    clubmate = clientFor(t.app, t.config, user);
  });

  it('copies a revision into a new model in another workspace, keeping the lineage both ways', async () => {
    const response = await clubmate
      .post(`/api/models/${source.model.id}/fork`, { number: 1, workspace: clubWorkspaceId, name: 'Heron 3.4' })
      .expect(201);
    const { model, revision } = response.body.data;
    expect(model).toMatchObject({
      name: 'Heron 3.4',
      workspace_id: clubWorkspaceId,
      airframe: 'glider',
      forked_from_revision_id: source.revision.id,
      forked_from: {
        revision_id: source.revision.id,
        number: 1,
        model_id: source.model.id,
        model_name: 'Sedge 3.4',
        readable: true,
      },
      role: 'owner',
    });
    expect(revision).toMatchObject({
      number: 1,
      origin: 'fork',
      source_revision_id: source.revision.id,
      content_hash: source.revision.content_hash,
      message: 'Forked from Sedge 3.4, revision 1',
    });
    expect((await Revision.findByPk(revision.id))!.yamlText).toBe(GLIDER());
    expect((await clubmate.get(`/api/models/${model.id}`).expect(200)).body.data.forked_from.model_name).toBe(
      'Sedge 3.4',
    );

    const event = await AuditEvent.findOne({ where: { subjectId: model.id, action: 'model.forked' } });
    expect(event!.details).toMatchObject({
      source_model_id: source.model.id,
      source_revision_id: source.revision.id,
      source_number: 1,
    });
  });

  it('forks into the same workspace with a default name, and compares the fork with its source', async () => {
    const { model, revision } = (
      await editor.post(`/api/models/${source.model.id}/fork`, { number: 2, workspace: roles.workspace.id }).expect(201)
    ).body.data;
    expect(model.name).toBe('Sedge 3.4 (fork)');
    const sourceRevision2 = await Revision.findOne({ where: { modelId: source.model.id, number: 2 } });
    expect(model.forked_from_revision_id).toBe(sourceRevision2!.id);
    const comparison = (await editor.get(`/api/compare?from=${sourceRevision2!.id}&to=${revision.id}`).expect(200)).body
      .data;
    expect(comparison.changes).toEqual([]);
    expect(comparison.from.model.id).toBe(source.model.id);
    expect(comparison.to.model.id).toBe(model.id);
  });

  it("hides the source's name from a reader of the fork who cannot read the source", async () => {
    const { model } = (
      await clubmate
        .post(`/api/models/${source.model.id}/fork`, { number: 1, workspace: clubWorkspaceId, name: 'Private heron' })
        .expect(201)
    ).body.data;
    const stranger = await createUser({ name: 'Reads only the club-mate' });
    await addMember((await Workspace.findByPk(clubWorkspaceId))!, stranger, 'viewer');
    const seen = (await clientFor(t.app, t.config, stranger).get(`/api/models/${model.id}`).expect(200)).body.data
      .forked_from;
    expect(seen).toEqual({
      revision_id: source.revision.id,
      number: 1,
      model_id: source.model.id,
      model_name: null,
      workspace_id: null,
      readable: false,
    });
  });

  it('needs editor in the target workspace and read access to the source', async () => {
    // The club-mate only views this workspace: forking into it is refused.
    expect(
      (
        await clubmate
          .post(`/api/models/${source.model.id}/fork`, { number: 1, workspace: roles.workspace.id })
          .expect(403)
      ).body.error.code,
    ).toBe('role-too-low');
    // Nobody forks a model they cannot read, nor into a workspace they are not in.
    const outsider = clientFor(t.app, t.config, roles.outsider);
    expect(
      (
        await outsider
          .post(`/api/models/${source.model.id}/fork`, { number: 1, workspace: roles.otherWorkspace.id })
          .expect(404)
      ).body.error.code,
    ).toBe('model-not-found');
    expect(
      (
        await editor
          .post(`/api/models/${source.model.id}/fork`, { number: 1, workspace: roles.otherWorkspace.id })
          .expect(404)
      ).body.error.code,
    ).toBe('workspace-not-found');
    expect(
      (
        await editor
          .post(`/api/models/${source.model.id}/fork`, { number: 7, workspace: roles.workspace.id })
          .expect(404)
      ).body.error.code,
    ).toBe('revision-not-found');
    await editor.post(`/api/models/${source.model.id}/fork`, { number: 1 }).expect(400);
  });
});

describe('GET /api/workspaces/:ws/audit', () => {
  it('lists saves, reverts, forks, uploads and tags for owners, newest first', async () => {
    const user = await createUser({ name: 'Auditor' });
    const workspace = await createWorkspace({ name: 'Audited', owner: user });
    const me = clientFor(t.app, t.config, user);
    const { model, revision } = await createModelVia(me, workspace.id, { name: 'Audited model', yaml: TRAINER() });
    await saveVia(me, model.id, 1, SCALE());
    await me.post(`/api/models/${model.id}/revert`, { number: 1, base: 2 }).expect(201);
    await me.post(`/api/revisions/${revision.id}/tags`, { name: 'maiden' }).expect(201);
    await me.upload(`/api/models/${model.id}/upload`, TRAINER(), { name: 'trainer.yaml' }, { base: 3 }).expect(201);
    await me.post(`/api/models/${model.id}/fork`, { number: 1, workspace: workspace.id, name: 'Copy' }).expect(201);
    await me.delete(`/api/revisions/${revision.id}/tags/maiden`).expect(200);

    const body = (await me.get(`/api/workspaces/${workspace.id}/audit`).expect(200)).body;
    const events: { action: string; created_at: string }[] = body.data;
    expect(events.map((event) => event.action).sort()).toEqual(
      [
        'model.created',
        'model.forked',
        'revision.reverted',
        'revision.saved',
        'revision.uploaded',
        'tag.added',
        'tag.removed',
      ].sort(),
    );
    const times = events.map((event) => Date.parse(event.created_at));
    expect([...times].sort((a, b) => b - a)).toEqual(times);
    const created = body.data.find((event: { action: string }) => event.action === 'model.created');
    expect(created).toMatchObject({
      actor: { id: user.id, name: 'Auditor' },
      subject: { type: 'model', id: model.id },
      details: { name: 'Audited model', origin: 'create' },
    });
    expect(body.pagination).toEqual({ limit: 50, offset: 0, total: 7 });
    const copy = body.data.find((event: { action: string }) => event.action === 'model.forked').subject.id;
    const modelOf = Object.fromEntries(
      body.data.map((event: { action: string; model: unknown }) => [event.action, event.model]),
    );
    for (const action of [
      'model.created',
      'revision.saved',
      'revision.reverted',
      'revision.uploaded',
      'tag.added',
      'tag.removed',
    ]) {
      expect(modelOf[action]).toEqual({ id: model.id, name: 'Audited model' });
    }
    expect(modelOf['model.forked']).toEqual({ id: copy, name: 'Copy' });
  });

  it('names the model of an event by its subject, as the model is called now, also for events whose details do not name it', async () => {
    const user = await createUser({ name: 'Keeper' });
    const workspace = await createWorkspace({ name: 'Old trail', owner: user });
    const me = clientFor(t.app, t.config, user);
    const { model, revision } = await createModelVia(me, workspace.id, { name: 'Before', yaml: TRAINER() });
    await AuditEvent.create({
      workspaceId: workspace.id,
      actorId: user.id,
      action: 'revision.saved',
      subjectType: 'revision',
      subjectId: revision.id,
      details: { number: 1 },
    });
    await me.patch(`/api/models/${model.id}`, { name: 'After' }).expect(200);
    await AuditEvent.create({
      workspaceId: workspace.id,
      actorId: user.id,
      action: 'member.left',
      subjectType: 'member',
      subjectId: user.id,
      details: {},
    });

    const events: { action: string; model: unknown }[] = (
      await me.get(`/api/workspaces/${workspace.id}/audit`).expect(200)
    ).body.data;
    expect(events.find((event) => event.action === 'revision.saved')!.model).toEqual({ id: model.id, name: 'After' });
    expect(events.find((event) => event.action === 'model.renamed')!.model).toEqual({ id: model.id, name: 'After' });
    expect(events.find((event) => event.action === 'member.left')!.model).toBeNull();
  });

  it('is for owners only', async () => {
    for (const role of ['editor', 'reviewer', 'viewer'] as const) {
      const response = await clientFor(t.app, t.config, roles.members[role])
        .get(`/api/workspaces/${roles.workspace.id}/audit`)
        .expect(403);
      expect(response.body.error.code).toBe('role-too-low');
    }
    await owner.get(`/api/workspaces/${roles.workspace.id}/audit`).expect(200);
    await owner.get(`/api/workspaces/${roles.otherWorkspace.id}/audit`).expect(404);
  });
});
