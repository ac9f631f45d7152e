import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Revision, SetupModel, Tag } from '@api/models';
import { parseCommitMessage, formatCommitMessage } from '@api/portability/commit-message';
import { createRoleFixture, type RoleFixture } from './helpers/factories';
import { importDone, importFailed, queueImport, useImportWorker } from './helpers/imports';
import { useTestApp } from './helpers/test-app';
import { clientFor, edit, GLIDER, TRAINER, type Client } from './models-support';

const t = useTestApp();
useImportWorker(t);
let roles: RoleFixture;
let editor: Client;
let outsider: Client;
let folder: string;

// git with no configuration of the machine's or the user's, as the app runs it.
const gitEnv = {
  PATH: process.env.PATH,
  HOME: os.tmpdir(),
  GIT_CONFIG_NOSYSTEM: '1',
  GIT_CONFIG_GLOBAL: '/dev/null',
  LANG: 'C',
  GIT_AUTHOR_NAME: 'Hand Kept',
  GIT_AUTHOR_EMAIL: 'hand@test.example',
  GIT_COMMITTER_NAME: 'Hand Kept',
  GIT_COMMITTER_EMAIL: 'hand@test.example',
};
const git = (cwd: string, ...args: string[]) => execFileSync('git', args, { cwd, env: gitEnv, encoding: 'utf8' });

beforeAll(async () => {
  roles = await createRoleFixture();
  editor = clientFor(t.app, t.config, roles.members.editor);
  outsider = clientFor(t.app, t.config, roles.outsider);
  folder = mkdtempSync(path.join(os.tmpdir(), 'bindery-portability-'));
});

afterAll(() => rmSync(folder, { recursive: true, force: true }));

const binary = (test: request.Test) =>
  test.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (chunk: Buffer) => chunks.push(chunk));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  });

async function download(client: Client, url: string): Promise<{ bundle: Buffer; response: request.Response }> {
  const response = await binary(client.get(url)).expect(200);
  return { bundle: response.body as Buffer, response };
}

function cloneBundle(bundle: Buffer, name: string): string {
  const file = path.join(folder, `${name}.bundle`);
  writeFileSync(file, bundle);
  const target = path.join(folder, name);
  execFileSync('git', ['clone', '--quiet', file, target], { env: gitEnv });
  return target;
}

interface Built {
  modelId: string;
  messages: string[];
}

/** A model with a history that tests every corner the export has to keep. */
async function buildHistory(client: Client, workspaceId: string, name: string): Promise<Built> {
  const first = TRAINER();
  const created = await client
    .post(`/api/workspaces/${workspaceId}/models`, { name, yaml: first, message: 'Maiden setup from the club sheet' })
    .expect(201);
  const modelId = created.body.data.model.id as string;
  const messages = ['Maiden setup from the club sheet'];
  const save = async (yaml: string, message: string) => {
    const base = messages.length;
    await client.post(`/api/models/${modelId}/revisions`, { base, yaml, message }).expect(201);
    messages.push(message);
  };
  const second = edit(first, 'name: Meadowlark 40', 'name: Meadowlark 40 mk2');
  await save(second, 'Renamed after the rebuild\n\nThe wing was replaced.\nBindery-Revision: 99');
  await save(second, '');
  await save(GLIDER(), 'Tried the glider layout <b>for fun</b>');
  await client.post(`/api/models/${modelId}/revert`, { number: 2, base: 4, message: 'Back to revision 2' }).expect(201);
  messages.push('Back to revision 2');
  const revisions = (await client.get(`/api/models/${modelId}/revisions?limit=100`).expect(200)).body.data as {
    id: string;
    number: number;
  }[];
  const byNumber = new Map(revisions.map((revision) => [revision.number, revision.id]));
  await client.post(`/api/revisions/${byNumber.get(1)}/tags`, { name: 'maiden' }).expect(201);
  await client.post(`/api/revisions/${byNumber.get(5)}/tags`, { name: 'season-2026' }).expect(201);
  return { modelId, messages };
}

const historyOf = async (modelId: string) =>
  (await Revision.findAll({ where: { modelId }, order: [['number', 'ASC']] })).map((revision) => ({
    number: revision.number,
    message: revision.message,
    contentHash: revision.contentHash,
    yamlText: revision.yamlText,
    seconds: Math.floor(revision.createdAt.getTime() / 1000),
  }));

const tagsOf = async (modelId: string) =>
  (
    await Tag.findAll({
      where: { modelId },
      include: [{ model: Revision, as: 'revision', attributes: ['number'] }],
      order: [['name', 'ASC']],
    })
  ).map((tag) => [tag.name, tag.revision!.number]);

describe('a model’s history as a git bundle', () => {
  let built: Built;
  let bundle: Buffer;

  beforeAll(async () => {
    built = await buildHistory(editor, roles.workspace.id, 'Tern "1800" / club');
    const answer = await download(
      clientFor(t.app, t.config, roles.members.viewer),
      `/api/models/${built.modelId}/export.git`,
    );
    bundle = answer.bundle;
    expect(answer.response.headers['content-disposition']).toBe('attachment; filename=tern-1800-club.bundle');
  });

  it('clones into a plain repository: one commit per revision with author, time and message, setup.yaml, tags as git tags', async () => {
    const clone = cloneBundle(bundle, 'single');
    const stored = await historyOf(built.modelId);
    const log = git(clone, 'log', '--reverse', '--format=%an|%ae|%at|%s').trim().split('\n');
    expect(log).toHaveLength(5);
    log.forEach((line, index) => {
      const [name, email, time] = line.split('|');
      expect({ name, email, time: Number(time) }).toEqual({
        name: roles.members.editor.name,
        email: roles.members.editor.email,
        time: stored[index].seconds,
      });
    });
    expect(log.map((line) => line.split('|')[3])).toEqual([
      'Maiden setup from the club sheet',
      'Renamed after the rebuild',
      'Revision 3',
      'Tried the glider layout <b>for fun</b>',
      'Back to revision 2',
    ]);
    expect(readFileSync(path.join(clone, 'setup.yaml'), 'utf8')).toBe(stored[4].yamlText);
    expect(git(clone, 'show', 'HEAD~2:setup.yaml')).toBe(stored[2].yamlText);
    expect(git(clone, 'tag', '--list').trim().split('\n')).toEqual(['maiden', 'season-2026']);
    expect(git(clone, 'rev-list', '-n', '1', 'maiden').trim()).toBe(
      git(clone, 'rev-list', '--max-parents=0', 'HEAD').trim(),
    );
    expect(git(clone, 'log', '-1', '--format=%B', 'HEAD~3')).toContain(
      `Bindery-Content-Hash: ${stored[1].contentHash}`,
    );
  });

  it('is the same bundle every time: the history decides the commit ids', async () => {
    const again = await download(editor, `/api/models/${built.modelId}/export.git`);
    expect(again.bundle.equals(bundle)).toBe(true);
  });

  it('imports as a new model with the same revisions in order: texts, content hashes, messages, times and tags', async () => {
    const job = await importDone(outsider, roles.otherWorkspace.id, bundle);
    expect(job.progress).toMatchObject({ commits_total: 5, commits_read: 5, revisions_total: 5, revisions_stored: 5 });
    const [result] = job.models;
    expect(result).toMatchObject({
      model: { name: 'Tern "1800" / club', workspace_id: roles.otherWorkspace.id },
      revisions: 5,
      tags: 2,
      hash_mismatches: [],
    });
    const original = await historyOf(built.modelId);
    const imported = await historyOf(result.model.id);
    expect(imported).toEqual(original);
    expect(imported.map((revision) => revision.message)).toEqual(built.messages);
    expect(await tagsOf(result.model.id)).toEqual(await tagsOf(built.modelId));
    const authors = await Revision.findAll({ where: { modelId: result.model.id }, attributes: ['authorId', 'origin'] });
    expect(new Set(authors.map((revision) => `${revision.authorId}/${revision.origin}`))).toEqual(
      new Set([`${roles.outsider.id}/upload`]),
    );
  });

  it('takes a name for the new model from the form', async () => {
    const job = await importDone(editor, roles.workspace.id, bundle, { name: 'Tern, second airframe' });
    expect(job.models[0].model.name).toBe('Tern, second airframe');
  });
});

describe('a whole workspace as a git bundle', () => {
  it('keeps a folder per model, with the commits of all models in time order, and imports back model by model', async () => {
    const workspace = roles.otherWorkspace.id;
    await buildHistory(outsider, workspace, 'Ridge Runner');
    await buildHistory(outsider, workspace, 'Ridge Runner');
    const before = await SetupModel.findAll({
      where: { workspaceId: workspace },
      order: [
        ['createdAt', 'ASC'],
        ['id', 'ASC'],
      ],
    });
    const { bundle, response } = await download(outsider, `/api/workspaces/${workspace}/export.git`);
    expect(response.headers['content-disposition']).toBe('attachment; filename=elsewhere-workspace.bundle');

    const clone = cloneBundle(bundle, 'workspace');
    const folders = git(clone, 'ls-tree', '--name-only', 'HEAD').trim().split('\n');
    expect(folders).toContain('ridge-runner');
    expect(folders).toContain('ridge-runner-2');
    expect(git(clone, 'tag', '--list', 'ridge-runner*').trim().split('\n')).toEqual([
      'ridge-runner-2/maiden',
      'ridge-runner-2/season-2026',
      'ridge-runner/maiden',
      'ridge-runner/season-2026',
    ]);
    const total = await Revision.count({ where: { modelId: before.map((model) => model.id) } });
    expect(Number(git(clone, 'rev-list', '--count', 'HEAD').trim())).toBe(total);
    const times = git(clone, 'log', '--reverse', '--format=%at').trim().split('\n').map(Number);
    expect([...times].sort((x, y) => x - y)).toEqual(times);

    const imported = (await importDone(editor, roles.workspace.id, bundle)).models;
    expect(imported).toHaveLength(before.length);
    const originalHashes = await Promise.all(
      before.map(async (model) =>
        (await historyOf(model.id)).map(({ contentHash, message }) => [contentHash, message]),
      ),
    );
    const importedHashes = await Promise.all(
      imported.map(async ({ model }) =>
        (await historyOf(model.id)).map(({ contentHash, message }) => [contentHash, message]),
      ),
    );
    expect(new Set(importedHashes.map((entry) => JSON.stringify(entry)))).toEqual(
      new Set(originalHashes.map((entry) => JSON.stringify(entry))),
    );
    expect(imported.map(({ model }) => model.name).sort()).toEqual(before.map((model) => model.name).sort());
  });
});

describe('a repository kept by hand', () => {
  it('imports the commits that change setup.yaml, with their messages and times', async () => {
    const repo = path.join(folder, 'by-hand');
    git(folder, 'init', '--quiet', '--initial-branch', 'main', repo);
    const commit = (message: string, when: number) =>
      execFileSync('git', ['commit', '--quiet', '--allow-empty', '-m', message], {
        cwd: repo,
        env: { ...gitEnv, GIT_AUTHOR_DATE: `@${when} +0000`, GIT_COMMITTER_DATE: `@${when} +0000` },
      });
    writeFileSync(path.join(repo, 'notes.txt'), 'club notes\n');
    git(repo, 'add', 'notes.txt');
    commit('Notes first', 1_700_000_000);
    writeFileSync(path.join(repo, 'setup.yaml'), TRAINER());
    git(repo, 'add', 'setup.yaml');
    commit('First setup\n\nFrom the bench.', 1_700_000_100);
    writeFileSync(path.join(repo, 'notes.txt'), 'more notes\n');
    git(repo, 'add', 'notes.txt');
    commit('Only notes changed', 1_700_000_200);
    writeFileSync(path.join(repo, 'setup.yaml'), GLIDER());
    git(repo, 'add', 'setup.yaml');
    commit('Glider layout', 1_700_000_300);
    git(repo, 'tag', '-a', '-m', 'annotated', 'field-day', 'HEAD');
    git(repo, 'tag', 'Not_A_Slug', 'HEAD');
    git(repo, 'bundle', 'create', '--quiet', path.join(folder, 'by-hand.bundle'), '--all');

    const [result] = (await importDone(editor, roles.workspace.id, readFileSync(path.join(folder, 'by-hand.bundle'))))
      .models;
    expect(result).toMatchObject({ revisions: 2, tags: 1 });
    const history = await historyOf(result.model.id);
    expect(history.map(({ message, yamlText, seconds }) => ({ message, yamlText, seconds }))).toEqual([
      { message: 'First setup\n\nFrom the bench.', yamlText: TRAINER(), seconds: 1_700_000_100 },
      { message: 'Glider layout', yamlText: GLIDER(), seconds: 1_700_000_300 },
    ]);
    expect(await tagsOf(result.model.id)).toEqual([['field-day', 2]]);
  });
});

describe('refusals', () => {
  it('refuses a file that is not a git bundle, and unreadable setups in a history, storing nothing', async () => {
    const before = await SetupModel.count();
    const notBundle = await queueImport(editor, roles.workspace.id, Buffer.from('model: {name: x}\n')).expect(415);
    expect(notBundle.body.error.code).toBe('not-a-git-bundle');
    const truncated = await queueImport(
      editor,
      roles.workspace.id,
      Buffer.from('# v2 git bundle\nabc refs/heads/main\n\nPACKgarbage'),
    ).expect(422);
    expect(truncated.body.error.code).toBe('not-a-git-bundle');

    const repo = path.join(folder, 'broken');
    git(folder, 'init', '--quiet', '--initial-branch', 'main', repo);
    writeFileSync(path.join(repo, 'setup.yaml'), TRAINER());
    git(repo, 'add', 'setup.yaml');
    git(repo, 'commit', '--quiet', '-m', 'good');
    writeFileSync(path.join(repo, 'setup.yaml'), 'model: [unclosed\n');
    git(repo, 'commit', '--quiet', '-am', 'broken');
    git(repo, 'bundle', 'create', '--quiet', path.join(folder, 'broken.bundle'), '--all');
    const unreadable = await importFailed(editor, roles.workspace.id, readFileSync(path.join(folder, 'broken.bundle')));
    expect(unreadable).toMatchObject({ status: 422, code: 'unreadable-setup', details: { revision: 2 } });
    expect(unreadable.message).toContain('revision 2');

    const empty = path.join(folder, 'no-setup');
    git(folder, 'init', '--quiet', '--initial-branch', 'main', empty);
    writeFileSync(path.join(empty, 'readme.txt'), 'nothing here\n');
    git(empty, 'add', 'readme.txt');
    git(empty, 'commit', '--quiet', '-m', 'readme');
    git(empty, 'bundle', 'create', '--quiet', path.join(folder, 'no-setup.bundle'), '--all');
    expect(
      (await importFailed(editor, roles.workspace.id, readFileSync(path.join(folder, 'no-setup.bundle')))).code,
    ).toBe('no-setup-in-history');

    await editor.post(`/api/workspaces/${roles.workspace.id}/import`, { file: 'x' }).expect(415);
    expect(await SetupModel.count()).toBe(before);
  });

  it('lets readers export and editors import; others are refused like anywhere else', async () => {
    const { modelId } = await buildHistory(editor, roles.workspace.id, 'Access check');
    const bundle = (await download(editor, `/api/models/${modelId}/export.git`)).bundle;
    await binary(outsider.get(`/api/models/${modelId}/export.git`)).expect(404);
    await binary(outsider.get(`/api/workspaces/${roles.workspace.id}/export.git`)).expect(404);
    const viewer = clientFor(t.app, t.config, roles.members.viewer);
    expect((await queueImport(viewer, roles.workspace.id, bundle).expect(403)).body.error.code).toBe('role-too-low');
    await queueImport(outsider, roles.workspace.id, bundle).expect(404);
    await request(t.app).get(`/api/models/${modelId}/export.git`).expect(401);
  });
});

describe('commit messages', () => {
  it.each([
    ['a plain message', 'Moved the flaps to channel 7'],
    ['an empty message', ''],
    ['several paragraphs', 'Subject\n\nBody line one.\n\nBody two.'],
    ['trailer-like lines of its own', 'Fix\n\nBindery-Revision: 12\nBindery-Content-Hash: nope'],
    ['trailing blank lines', 'Spaced\n\n\n'],
  ])('round-trips %s exactly', (_label, message) => {
    const formatted = formatCommitMessage(message, { modelName: 'Kite', number: 3, contentHash: 'ab'.repeat(32) });
    expect(parseCommitMessage(formatted)).toEqual({
      message,
      trailers: { folder: undefined, modelName: 'Kite', number: 3, contentHash: 'ab'.repeat(32) },
    });
  });
});
