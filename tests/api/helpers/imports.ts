import { setTimeout as sleep } from 'node:timers/promises';
import { afterAll, beforeAll, expect } from 'vitest';
import { startImportWorker, type ImportWorker } from '@api/portability/import-worker';
import type { Client } from '../models-support';
import type { TestApp } from './test-app';

// History imports are jobs: these start the import worker beside the test's app and
// follow a job from its 202 to its end, as the web client does.

export function useImportWorker(t: Pick<TestApp, 'sequelize'>): void {
  let worker: ImportWorker;
  beforeAll(() => {
    worker = startImportWorker(t.sequelize, { pollMs: 50, logErrors: false });
  });
  // Registered after the app's hooks, so it stops before the database closes.
  afterAll(() => worker.stop());
}

export interface ImportJobView {
  id: string;
  state: 'queued' | 'running' | 'done' | 'failed';
  progress: Record<string, number | null>;
  error: { status: number; code: string; message: string; details?: Record<string, unknown> } | null;
  models: { model: { id: string; name: string; workspace_id: string }; revisions: number; tags: number }[];
  [key: string]: unknown;
}

export const queueImport = (client: Client, workspaceId: string, bundle: Buffer, fields: Record<string, string> = {}) =>
  client.upload(
    `/api/workspaces/${workspaceId}/import`,
    bundle,
    { name: 'history.bundle', type: 'application/octet-stream' },
    fields,
  );

/** Polls the job until it has ended; the test's own time limit stops a job that never does. */
export async function waitForImport(client: Client, workspaceId: string, id: string): Promise<ImportJobView> {
  for (;;) {
    const job = (await client.get(`/api/workspaces/${workspaceId}/imports/${id}`).expect(200)).body
      .data as ImportJobView;
    if (job.state === 'done' || job.state === 'failed') return job;
    await sleep(25);
  }
}

/** Queues the bundle (expecting 202) and waits for the job's end. */
export async function importHistory(
  client: Client,
  workspaceId: string,
  bundle: Buffer,
  fields: Record<string, string> = {},
): Promise<ImportJobView> {
  const queued = await queueImport(client, workspaceId, bundle, fields).expect(202);
  // The worker may have taken it already between the insert and the answer.
  expect(['queued', 'running']).toContain(queued.body.data.state);
  return waitForImport(client, workspaceId, queued.body.data.id);
}

/** An import that must succeed: its job, done. */
export async function importDone(client: Client, workspaceId: string, bundle: Buffer, fields?: Record<string, string>) {
  const job = await importHistory(client, workspaceId, bundle, fields);
  expect(job.error, 'the import failed').toBeNull();
  expect(job.state).toBe('done');
  return job;
}

/** An import whose job must fail: its error. */
export async function importFailed(client: Client, workspaceId: string, bundle: Buffer) {
  const job = await importHistory(client, workspaceId, bundle);
  expect(job.state).toBe('failed');
  expect(job.models).toEqual([]);
  return job.error!;
}
