import { setTimeout as sleep } from 'node:timers/promises';
import { QueryTypes } from 'sequelize';
import type request from 'supertest';
import { afterEach, beforeAll, describe, expect, it } from 'vitest';
import { Membership, SetupModel } from '@api/models';
import { startImportWorker, type ImportWorker } from '@api/portability/import-worker';
import { addMember, createRoleFixture, createUser, uniqueEmail, type RoleFixture } from './helpers/factories';
import { queueImport, waitForImport } from './helpers/imports';
import { useTestApp } from './helpers/test-app';
import { clientFor, createModelVia, saveVia, edit, TRAINER, type Client } from './models-support';

// An import is checked against the requester's role when it is queued, and again when
// the job runs: a member who lost the editor role (or left) in between gets a failed job
// with the reason, and nothing is imported. No worker runs until each test starts one,
// so the change of role lands between the upload and the run.

const t = useTestApp();
let roles: RoleFixture;
let owner: Client;
let bundle: Buffer;
let worker: ImportWorker | null = null;

const binary = (test: request.Test) =>
  test.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (chunk: Buffer) => chunks.push(chunk));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  });

beforeAll(async () => {
  roles = await createRoleFixture();
  owner = clientFor(t.app, t.config, roles.members.owner);
  const created = await createModelVia(owner, roles.workspace.id, { name: 'Kestrel trainer', yaml: TRAINER() });
  await saveVia(owner, created.model.id, 1, edit(TRAINER(), 'name: Meadowlark 40', 'name: Meadowlark 40 mk2'));
  bundle = (await binary(owner.get(`/api/models/${created.model.id}/export.git`)).expect(200)).body as Buffer;
});

afterEach(async () => {
  await worker?.stop();
  worker = null;
});

const runWorker = () => (worker = startImportWorker(t.sequelize, { pollMs: 50, logErrors: false }));
const modelCount = () => SetupModel.count({ where: { workspaceId: roles.workspace.id } });

/** A fresh editor of the role fixture's workspace, and the import they queued (202). */
async function queuedByEditor() {
  const user = await createUser({ email: uniqueEmail('importer'), name: 'Importing Editor' });
  await addMember(roles.workspace, user, 'editor');
  const editor = clientFor(t.app, t.config, user);
  const queued = await queueImport(editor, roles.workspace.id, bundle).expect(202);
  expect(queued.body.data.state).toBe('queued');
  return { user, jobId: queued.body.data.id as string };
}

describe('the import job reads the requester’s role again when it runs', () => {
  it('fails with the reason and imports nothing when the requester became a viewer meanwhile', async () => {
    const before = await modelCount();
    const { user, jobId } = await queuedByEditor();
    await owner.patch(`/api/workspaces/${roles.workspace.id}/members/${user.id}`, { role: 'viewer' }).expect(200);

    runWorker();
    const job = await waitForImport(owner, roles.workspace.id, jobId);
    expect(job.state).toBe('failed');
    expect(job.error).toMatchObject({
      status: 403,
      code: 'requester-role-too-low',
      details: { required: 'editor', role: 'viewer' },
    });
    expect(job.error!.message).toMatch(/now viewer.*editor role or higher.*nothing was imported/);
    expect(job.models).toEqual([]);
    expect(await modelCount()).toBe(before);
  });

  it('fails with the reason and imports nothing when the requester was removed from the workspace meanwhile', async () => {
    const before = await modelCount();
    const { user, jobId } = await queuedByEditor();
    await owner.delete(`/api/workspaces/${roles.workspace.id}/members/${user.id}`).expect(200);

    runWorker();
    const job = await waitForImport(owner, roles.workspace.id, jobId);
    expect(job.error).toMatchObject({ status: 403, code: 'requester-not-member' });
    expect(job.error!.message).toMatch(/no longer a member.*nothing was imported/);
    expect(await modelCount()).toBe(before);
  });

  it('a role change that commits while the import is about to write wins: the import waits for it, then stores nothing', async () => {
    const before = await modelCount();
    const { user, jobId } = await queuedByEditor();
    // The change of role is made and held open, so the job's first check still sees an
    // editor; its write transaction then waits on the membership row until it commits.
    const change = await t.sequelize.transaction();
    await Membership.update(
      { role: 'viewer' },
      { where: { workspaceId: roles.workspace.id, userId: user.id }, transaction: change },
    );
    runWorker();
    for (;;) {
      const [{ waiting }] = await t.sequelize.query<{ waiting: number }>(
        `SELECT count(*)::int AS waiting FROM pg_locks WHERE NOT granted AND locktype IN ('transactionid', 'tuple')`,
        { type: QueryTypes.SELECT },
      );
      if (waiting > 0) break;
      await sleep(20);
    }
    await change.commit();

    const job = await waitForImport(owner, roles.workspace.id, jobId);
    expect(job.error).toMatchObject({ status: 403, code: 'requester-role-too-low' });
    expect(await modelCount()).toBe(before);
  });

  it('an editor who is still an editor gets the import', async () => {
    const before = await modelCount();
    const { jobId } = await queuedByEditor();
    runWorker();
    const job = await waitForImport(owner, roles.workspace.id, jobId);
    expect(job.error).toBeNull();
    expect(job.state).toBe('done');
    expect(await modelCount()).toBe(before + 1);
  });
});
