import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useId, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { FormAlert } from '../../../components/ui/form-alert';
import { isApiError } from '../../../lib/api-client';
import type { WorkspaceMembership } from '../../../types/api';
import { canEdit } from '../../models/permissions';
import { recentImportsQueryKey, useImportJob, useRecentImports, useUploadHistory } from '../api/import-history';
import { jobEnded } from '../types';
import { ImportProgress } from './import-progress';
import { RecentImports } from './recent-imports';

// The server's own limits (api/portability/import-limits.ts), checked here only for
// the file's size so a file that cannot be taken is not sent at all.
const MAX_BUNDLE_BYTES = 32 * 1024 * 1024;

/** Upload a history bundle; the import then runs on the server and this shows how it goes. */
export function ImportHistoryCard({ workspace }: { workspace: WorkspaceMembership }) {
  const headingId = useId();
  const fileId = useId();
  const [file, setFile] = useState<File | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [jobId, setJobId] = useState<string | null>(null);
  const upload = useUploadHistory();
  const editor = canEdit(workspace.role);
  const recent = useRecentImports(workspace.id, editor);
  const queryClient = useQueryClient();
  // Back on the screen while an import is still going: follow it again.
  const newest = recent.data?.[0];
  const followed = jobId ?? (newest && !jobEnded(newest) ? newest.id : null);
  const job = useImportJob(workspace.id, followed);
  const ended = job.data ? jobEnded(job.data) : false;
  useEffect(() => {
    if (ended) void queryClient.invalidateQueries({ queryKey: recentImportsQueryKey(workspace.id), exact: true });
  }, [ended, queryClient, workspace.id]);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (!file) return setProblem('Choose the .bundle file to import.');
    if (file.size > MAX_BUNDLE_BYTES) return setProblem('The file is larger than 32 MB, more than an import takes.');
    setProblem(null);
    upload.mutate(
      { workspaceId: workspace.id, file },
      {
        onSuccess: (queued) => setJobId(queued.id),
        onError: (error) => setProblem(isApiError(error) ? error.message : 'The file could not be sent.'),
      },
    );
  };

  return (
    <Card className="p-5" role="region" aria-labelledby={headingId}>
      <h2 id={headingId} className="text-lg font-semibold text-ink-900">
        Import history
      </h2>
      <p className="mt-2 max-w-prose text-base text-ink-700">
        Bring in a history saved as a git bundle: a backup from this page, or a repository you kept yourself with a{' '}
        <code className="font-mono">setup.yaml</code>. Each model in it becomes a new model here, revision by revision;
        nothing already here changes.
      </p>
      <p className="mt-2 max-w-prose text-sm text-ink-700">
        An import takes up to 32 MB and 10,000 commits, messages of up to 2,000 characters and setups of up to 512 KB.
        Imported setups are checked like any save: before flying one, check throws, failsafe and receiver power on the
        bench, props off, and follow your club’s and your national model-flying body’s rules.
      </p>
      {editor ? (
        <form className="mt-4 space-y-4" aria-label="Import history" onSubmit={submit} noValidate>
          <div>
            <label htmlFor={fileId} className="block text-sm font-medium text-ink-900">
              Backup file (.bundle)
            </label>
            <input
              id={fileId}
              type="file"
              accept=".bundle,application/x-git-bundle"
              onChange={(event) => setFile(event.target.files?.[0] ?? null)}
              className="mt-1.5 block w-full text-base text-ink-900 file:mr-3 file:h-10 file:rounded-md file:border file:border-ply-500 file:bg-paper-raised file:px-4 file:font-medium file:text-ink-900 hover:file:bg-ply-100"
            />
          </div>
          {problem && <FormAlert>{problem}</FormAlert>}
          <Button type="submit" pending={upload.isPending}>
            Import
          </Button>
        </form>
      ) : (
        <p className="mt-4 text-base text-ink-700">Importing needs the editor role or higher in {workspace.name}.</p>
      )}
      <div className="mt-4" aria-live="polite">
        {job.data && <ImportProgress job={job.data} />}
        {job.isError && <FormAlert>How the import is going could not be read just now; it goes on on the server.</FormAlert>}
      </div>
      <RecentImports jobs={(recent.data ?? []).filter((earlier) => earlier.id !== followed).slice(0, 5)} />
    </Card>
  );
}
