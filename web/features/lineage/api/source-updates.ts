import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { SourceUpdates } from '@shared/contract/provenance';
import type { MergeSide } from '@shared/lineage/merge-setups';
import { api } from '../../../lib/api-client';
import { paths } from '../../../lib/api-paths';
import type { Id } from '../../../types/api';
import { modelQueryKey } from '../../models/api/get-model';
import { revisionsQueryKey } from '../../models/api/list-revisions';
import { hangarQueryKey } from '../../models/api/list-models';
import type { SavedRevision, SetupModelView } from '../../models/types';

export const sourceUpdatesQueryKey = (modelId: Id) => ['source-updates', modelId] as const;

export async function getSourceUpdates(modelId: Id, signal?: AbortSignal): Promise<SourceUpdates> {
  return (await api.get<SourceUpdates>(paths.modelSourceUpdates(modelId), signal)).data;
}

export function sourceUpdatesQueryOptions(modelId: Id) {
  return queryOptions({
    queryKey: sourceUpdatesQueryKey(modelId),
    queryFn: ({ signal }) => getSourceUpdates(modelId, signal),
  });
}

/** What a fork's source changed since the fork last took it in; only asked for forks whose source the caller reads. */
export function useSourceUpdates(modelId: Id, enabled: boolean) {
  return useQuery({ ...sourceUpdatesQueryOptions(modelId), enabled });
}

export interface TakeInInput {
  modelId: Id;
  base: number;
  resolutions: Record<string, MergeSide>;
  message?: string;
}

export async function takeInSource({ modelId, ...body }: TakeInInput): Promise<SavedRevision> {
  return (await api.post<SavedRevision>(paths.modelSourceUpdates(modelId), body)).data;
}

export function useTakeInSource(model: Pick<SetupModelView, 'id' | 'workspace_id'>) {
  const queryClient = useQueryClient();
  // Settled, not only succeeded: a 409 or 422 means the sides moved on, and the screen should show it.
  return useMutation({
    mutationFn: takeInSource,
    onSettled: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: sourceUpdatesQueryKey(model.id) }),
        queryClient.invalidateQueries({ queryKey: modelQueryKey(model.id) }),
        queryClient.invalidateQueries({ queryKey: revisionsQueryKey(model.id) }),
        queryClient.invalidateQueries({ queryKey: hangarQueryKey(model.workspace_id) }),
      ]),
  });
}
