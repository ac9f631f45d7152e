import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, apiRequest } from '../../../lib/api-client';
import type { Id } from '../../../types/api';
import { hangarQueryKey } from '../../models/api/list-models';
import { jobEnded, type ImportJob } from '../types';
import { paths } from '../../../lib/api-paths';

export const importJobQueryKey = (workspaceId: Id, jobId: Id) => ['workspaces', workspaceId, 'imports', jobId] as const;

// The server works through an import in the background; while it does, the screen asks again this often.
const POLL_MS = 1000;

export async function uploadHistory(input: { workspaceId: Id; file: File }): Promise<ImportJob> {
  const form = new FormData();
  form.set('file', input.file);
  const path = paths.workspaceImport(input.workspaceId);
  return (await apiRequest<ImportJob>(path, { method: 'POST', body: form })).data;
}

export function useUploadHistory() {
  return useMutation({ mutationFn: uploadHistory });
}

/** One import, asked for again until it has ended; then the hangar is refreshed for its new models. */
export function useImportJob(workspaceId: Id, jobId: Id | null) {
  const queryClient = useQueryClient();
  return useQuery({
    queryKey: importJobQueryKey(workspaceId, jobId ?? ''),
    enabled: jobId !== null,
    queryFn: async ({ signal }) => {
      const job = (
        await api.get<ImportJob>(
          paths.workspaceImportJob(workspaceId, jobId!),
          signal,
        )
      ).data;
      if (job.state === 'done') await queryClient.invalidateQueries({ queryKey: hangarQueryKey(workspaceId) });
      return job;
    },
    refetchInterval: (query) => (query.state.data && jobEnded(query.state.data) ? false : POLL_MS),
  });
}

export const recentImportsQueryKey = (workspaceId: Id) => ['workspaces', workspaceId, 'imports'] as const;

/** The workspace's latest imports, newest first (editors and owners only). */
export function useRecentImports(workspaceId: Id, enabled: boolean) {
  return useQuery({
    queryKey: recentImportsQueryKey(workspaceId),
    enabled,
    queryFn: async ({ signal }) =>
      (await api.get<ImportJob[]>(paths.workspaceImports(workspaceId), signal)).data,
  });
}
