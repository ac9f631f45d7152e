import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Id } from '../../../types/api';
import type { SetupModelView } from '../types';
import { paths } from '../../../lib/api-paths';

export async function getModel(modelId: Id, signal?: AbortSignal): Promise<SetupModelView> {
  return (await api.get<SetupModelView>(paths.model(modelId), signal)).data;
}

export const modelQueryKey = (modelId: Id) => ['models', modelId] as const;

export function modelQueryOptions(modelId: Id) {
  return queryOptions({
    queryKey: modelQueryKey(modelId),
    queryFn: ({ signal }) => getModel(modelId, signal),
  });
}

/** The model with its latest revision, review state, lineage and the caller's role. */
export function useModel(modelId: Id) {
  return useQuery({ ...modelQueryOptions(modelId), enabled: modelId !== '' });
}
