import { SetupModel, type User } from '../models';
import type { Role } from '@shared/contract/roles';
import type { ImportJobRow } from '../portability/import-jobs';
import { presentModels } from './model-views';

/** Jobs as the import routes show them: progress, the refusal, or the new models as model lists show them. */
export async function presentImportJobs(jobs: readonly ImportJobRow[], role: Role, user: User) {
  const ids = [...new Set(jobs.flatMap((job) => job.result_model_ids))];
  const models = ids.length > 0 ? await SetupModel.findAll({ where: { id: ids } }) : [];
  const presented = new Map((await presentModels(models, role, user)).map((model) => [model.id, model]));
  return jobs.map((job) => ({
    id: job.id,
    workspace_id: job.workspace_id,
    state: job.state,
    file_name: job.file_name,
    bundle_bytes: job.bundle_bytes,
    requested_by: { id: job.requested_by, name: job.requested_by_name },
    progress: {
      commits_total: job.progress.commits_total ?? null,
      commits_read: job.progress.commits_read ?? 0,
      revisions_total: job.progress.revisions_total ?? null,
      revisions_checked: job.progress.revisions_checked ?? 0,
      revisions_stored: job.progress.revisions_stored ?? 0,
    },
    error: job.error,
    // A model deleted since the import is left out.
    models: (job.result ?? []).flatMap((entry) => {
      const model = presented.get(entry.model_id);
      return model
        ? [{ model, revisions: entry.revisions, tags: entry.tags, hash_mismatches: entry.hash_mismatches }]
        : [];
    }),
    created_at: job.created_at,
    started_at: job.started_at,
    finished_at: job.finished_at,
  }));
}
