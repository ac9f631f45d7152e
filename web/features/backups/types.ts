import type { Id } from '../../types/api';

// A history import as GET /api/workspaces/:ws/imports/:id answers it.

export type ImportJobState = 'queued' | 'running' | 'done' | 'failed';

export interface ImportJob {
  id: Id;
  workspace_id: Id;
  state: ImportJobState;
  file_name: string;
  bundle_bytes: number;
  requested_by: { id: Id; name: string | null };
  progress: {
    commits_total: number | null;
    commits_read: number;
    revisions_total: number | null;
    revisions_checked: number;
    revisions_stored: number;
  };
  error: { status: number; code: string; message: string; details?: Record<string, unknown> } | null;
  models: { model: { id: Id; name: string }; revisions: number; tags: number }[];
  created_at: string;
  started_at: string | null;
  finished_at: string | null;
}

export const jobEnded = (job: ImportJob) => job.state === 'done' || job.state === 'failed';
