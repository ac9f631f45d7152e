import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { Revision, SetupModel } from '@api/models';
import {
  EARLIEST_AUTHOR_DATE,
  MAX_IMPORT_COMMITS,
  MAX_MESSAGE_CHARS,
  MAX_SETUP_BYTES,
} from '@api/portability/import-limits';
import { createRoleFixture, type RoleFixture } from './helpers/factories';
import { bundleOf, setupCommits } from '../../scripts/lib/fake-git-history';
import { importDone, importFailed, queueImport, useImportWorker, waitForImport } from './helpers/imports';
import { useTestApp } from './helpers/test-app';
import { clientFor, edit, TRAINER, type Client } from './models-support';

// Hostile histories: each is refused with the limit it passed named, and leaves
// nothing behind; a large honest one runs while the server keeps answering.

const t = useTestApp();
useImportWorker(t);
let roles: RoleFixture;
let editor: Client;
let ws: string;

beforeAll(async () => {
  roles = await createRoleFixture();
  editor = clientFor(t.app, t.config, roles.members.editor);
  ws = roles.workspace.id;
});

const variant = (i: number) => edit(TRAINER(), 'name: Meadowlark 40', `name: Meadowlark 40 no. ${i}`);
const stored = async () => ({ models: await SetupModel.count(), revisions: await Revision.count() });

async function expectRefused(bundle: Buffer, status: number, code: string) {
  const before = await stored();
  const error = await importFailed(editor, ws, bundle);
  expect(error).toMatchObject({ status, code });
  expect(await stored()).toEqual(before);
  return error;
}

describe('a history past the import’s limits', () => {
  it('refuses commit messages of megabytes unread, naming the message limit', async () => {
    const huge = 'Tuned the flaps. '.repeat((3 * 1024 * 1024) / 17);
    const bundle = bundleOf(
      [...setupCommits(5, variant)].map((commit, i) => ({ ...commit, message: i === 0 ? 'First' : huge })),
    );
    const error = await expectRefused(bundle, 422, 'message-too-long');
    expect(error.details).toMatchObject({ limit: MAX_MESSAGE_CHARS });
    expect(error.details!.bytes as number).toBeGreaterThan(3_000_000);
    expect(error.message).toContain(`${MAX_MESSAGE_CHARS} characters`);
  });

  it('refuses a message one character longer than a save takes, and takes one at the limit', async () => {
    const atLimit = 'x'.repeat(MAX_MESSAGE_CHARS);
    const ok = await importDone(
      editor,
      ws,
      bundleOf([...setupCommits(2, variant)].map((commit) => ({ ...commit, message: atLimit }))),
    );
    expect(ok.models[0].revisions).toBe(2);
    const error = await expectRefused(
      bundleOf(
        [...setupCommits(2, variant)].map((commit, i) => ({ ...commit, message: `${atLimit}${'y'.repeat(i)}` })),
      ),
      422,
      'message-too-long',
    );
    expect(error.details).toMatchObject({ characters: MAX_MESSAGE_CHARS + 1, limit: MAX_MESSAGE_CHARS });
  });

  it(`refuses ${2 * MAX_IMPORT_COMMITS} commits at the commit limit`, async () => {
    const bundle = bundleOf(setupCommits(2 * MAX_IMPORT_COMMITS, (i) => `model: {name: Save ${i}}\n`));
    const error = await expectRefused(bundle, 422, 'too-many-commits');
    expect(error.details).toEqual({ limit: MAX_IMPORT_COMMITS });
    expect(error.message).toContain(String(MAX_IMPORT_COMMITS));
  });

  it('refuses a setup.yaml that is a submodule, saying so', async () => {
    const bundle = bundleOf([
      { message: 'Linked', when: 1_700_000_000, files: { 'setup.yaml': { submodule: 'ab'.repeat(20) } } },
    ]);
    const error = await expectRefused(bundle, 422, 'setup-not-a-file');
    expect(error.message).toContain('submodule');
    expect(error.details).toMatchObject({ file: 'setup.yaml', mode: '160000' });
  });

  it('refuses a submodule in a model’s folder after good revisions', async () => {
    const bundle = bundleOf([
      { message: 'Good', when: 1_700_000_000, files: { 'wing/setup.yaml': TRAINER() } },
      { message: 'Linked', when: 1_700_000_060, files: { 'tail/setup.yaml': { submodule: 'cd'.repeat(20) } } },
    ]);
    expect((await expectRefused(bundle, 422, 'setup-not-a-file')).details).toMatchObject({ file: 'tail/setup.yaml' });
  });

  it.each([
    ['in the year 5138', 99_999_999_999],
    ['before 1990', Math.floor(EARLIEST_AUTHOR_DATE.getTime() / 1000) - 1],
    ['two days ahead', Math.floor(Date.now() / 1000) + 2 * 86_400],
  ])('refuses an author date %s', async (_label, when) => {
    const bundle = bundleOf([
      { message: 'Fine', when: 1_700_000_000, files: { 'setup.yaml': variant(1) } },
      { message: 'Odd clock', when, files: { 'setup.yaml': variant(2) } },
    ]);
    const error = await expectRefused(bundle, 422, 'author-date-out-of-range');
    expect(error.details).toMatchObject({ earliest: EARLIEST_AUTHOR_DATE.toISOString() });
  });

  it('refuses a setup larger than a save takes with 413, naming the limit', async () => {
    const large = `${TRAINER()}\n# ${'padding '.repeat(MAX_SETUP_BYTES / 8)}\n`;
    const bundle = bundleOf([{ message: 'Big', when: 1_700_000_000, files: { 'setup.yaml': large } }]);
    const error = await expectRefused(bundle, 413, 'setup-too-large');
    expect(error.details).toMatchObject({ limit: MAX_SETUP_BYTES });
  });

  it('refuses at upload what is cheap to see: a garbled or incomplete bundle', async () => {
    const garbled = await queueImport(editor, ws, Buffer.from('# v2 git bundle\nnot-a-ref\n\nPACK')).expect(422);
    expect(garbled.body.error.code).toBe('not-a-git-bundle');
    const partial = await queueImport(
      editor,
      ws,
      Buffer.from(`# v2 git bundle\n-${'a'.repeat(40)}\n${'b'.repeat(40)} refs/heads/main\n\nPACK`),
    ).expect(422);
    expect(partial.body.error.message).toContain('another repository');
  });
});

describe('a large honest import', () => {
  it('runs as a job while the server keeps answering', async () => {
    const revisions = 300;
    const queued = await queueImport(editor, ws, bundleOf(setupCommits(revisions, variant))).expect(202);
    const id = queued.body.data.id as string;
    let answeredWhileRunning = 0;
    let seenProgress = false;
    for (;;) {
      const health = await request(t.app).get('/api/health').expect(200);
      expect(health.body.data.status).toBe('ok');
      const job = (await editor.get(`/api/workspaces/${ws}/imports/${id}`).expect(200)).body.data;
      if (job.state === 'running') {
        answeredWhileRunning++;
        if (job.progress.revisions_checked > 0) seenProgress = true;
      }
      if (job.state === 'done' || job.state === 'failed') break;
    }
    const job = await waitForImport(editor, ws, id);
    expect(job.error).toBeNull();
    expect(job.models[0].revisions).toBe(revisions);
    expect(job.progress).toMatchObject({ commits_total: revisions, revisions_stored: revisions });
    expect(answeredWhileRunning).toBeGreaterThanOrEqual(3);
    expect(seenProgress).toBe(true);
    const list = (await editor.get(`/api/workspaces/${ws}/imports`).expect(200)).body.data as { id: string }[];
    expect(list[0].id).toBe(id);
  });

  it('shows a job only in its own workspace', async () => {
    const job = await importDone(editor, ws, bundleOf(setupCommits(1, variant)));
    const other = clientFor(t.app, t.config, roles.outsider);
    await other.get(`/api/workspaces/${roles.otherWorkspace.id}/imports/${job.id}`).expect(404);
    await editor.get(`/api/workspaces/${ws}/imports/not-a-uuid`).expect(404);
  });
});
