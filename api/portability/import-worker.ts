import { EventEmitter } from 'node:events';
import type { Sequelize } from 'sequelize';
import { HttpError } from '../errors';
import { User, Workspace } from '../models';
import {
  claimImportJob,
  failImportJob,
  finishImportJob,
  MAX_ATTEMPTS,
  reportImportProgress,
  type ClaimedImportJob,
  type ImportJobError,
} from './import-jobs';
import { readHistoryBundle } from './import-history';
import { importModels } from './import-models';
import { requireImportRights } from './import-rights';

// Runs queued history imports inside an API process, one at a time, off the request
// path: the upload route answers 202 and the job goes on here. Reading git's output
// and the database are waits, and the setup checks hand the thread back between
// small batches (import-models.ts), so requests keep being answered meanwhile.
// Several processes each run a worker safely: claims skip locked rows.

/** The upload route says a job is waiting, so a worker in the same process starts at once. */
export const importJobSignals = new EventEmitter();

export interface ImportWorker {
  /** Stops taking jobs; resolves when the job in hand (if any) has ended. */
  stop(): Promise<void>;
}

const unexpected: ImportJobError = {
  status: 500,
  code: 'import-failed',
  message: 'The import stopped on an unexpected error; nothing was imported. Try again, or ask the server’s keeper.',
};

async function runJob(sequelize: Sequelize, job: ClaimedImportJob, logErrors: boolean): Promise<void> {
  if (job.attempts > MAX_ATTEMPTS) {
    await failImportJob(sequelize, job.id, {
      ...unexpected,
      code: 'import-abandoned',
      message: `The import was started ${MAX_ATTEMPTS} times and never finished; nothing was imported.`,
    });
    return;
  }
  try {
    const [workspace, author] = await Promise.all([
      Workspace.findByPk(job.workspace_id),
      User.findByPk(job.requested_by),
    ]);
    if (!workspace || !author) throw new Error('the workspace or the account of the import is gone');
    const requester = { workspaceId: workspace.id, requestedBy: author.id };
    await requireImportRights(requester);
    const report = (update: Parameters<typeof reportImportProgress>[2]) =>
      reportImportProgress(sequelize, job.id, update);
    const models = await readHistoryBundle(job.bundle, report);
    const results = await importModels(
      sequelize,
      {
        workspace,
        author,
        models,
        name: job.model_name ?? undefined,
        requireRights: (transaction) => requireImportRights(requester, transaction),
      },
      report,
    );
    await finishImportJob(sequelize, job.id, results);
  } catch (error) {
    if (error instanceof HttpError) {
      await failImportJob(sequelize, job.id, {
        status: error.status,
        code: error.code,
        message: error.message,
        ...(error.details ? { details: error.details } : {}),
      });
    } else {
      if (logErrors) console.error('[import-failed]', error);
      await failImportJob(sequelize, job.id, unexpected);
    }
  }
}

export function startImportWorker(
  sequelize: Sequelize,
  options: { pollMs?: number; logErrors?: boolean } = {},
): ImportWorker {
  const pollMs = options.pollMs ?? 2_000;
  let stopped = false;
  let wake: (() => void) | null = null;
  const onQueued = () => wake?.();
  importJobSignals.on('queued', onQueued);

  const pause = () =>
    new Promise<void>((resolve) => {
      const timer = setTimeout(done, pollMs);
      function done() {
        clearTimeout(timer);
        wake = null;
        resolve();
      }
      wake = done;
    });

  const loop = (async () => {
    while (!stopped) {
      let job: ClaimedImportJob | null = null;
      try {
        job = await claimImportJob(sequelize);
      } catch (error) {
        // The database away for a moment: try again after the pause.
        if (options.logErrors ?? true) console.error('[import-worker]', error);
      }
      if (job) await runJob(sequelize, job, options.logErrors ?? true);
      else if (!stopped) await pause();
    }
  })();

  return {
    async stop() {
      stopped = true;
      importJobSignals.off('queued', onQueued);
      wake?.();
      await loop;
    },
  };
}
