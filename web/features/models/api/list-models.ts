import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Id } from '../../../types/api';
import type { SetupModelView } from '../types';
import { paths } from '../../../lib/api-paths';

// The hangar is sorted and searched in the browser, so one page holds all of a
// workspace's models: the API's largest page.
export const HANGAR_PAGE_SIZE = 200;

export interface Hangar {
  models: SetupModelView[];
  /** How many models the workspace has, when the API says; more than `models.length` when some did not fit. */
  total: number;
}

export async function listModels(workspaceId: Id, signal?: AbortSignal): Promise<Hangar> {
  const { data, pagination } = await api.get<SetupModelView[]>(
    paths.workspaceModels(workspaceId, { limit: HANGAR_PAGE_SIZE }),
    signal,
  );
  const total = typeof pagination?.total === 'number' ? pagination.total : data.length;
  return { models: data, total };
}

export const hangarQueryKey = (workspaceId: Id) => ['workspaces', workspaceId, 'models'] as const;

export function hangarQueryOptions(workspaceId: Id) {
  return queryOptions({
    queryKey: hangarQueryKey(workspaceId),
    queryFn: ({ signal }) => listModels(workspaceId, signal),
  });
}

/** The workspace's models with their latest revision and review state. */
export function useHangar(workspaceId: Id | null) {
  return useQuery({ ...hangarQueryOptions(workspaceId ?? ''), enabled: Boolean(workspaceId) });
}
