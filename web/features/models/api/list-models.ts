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
  /** How many of the workspace's models are archived (listed only when asked for). */
  archived: number;
}

export async function listModels(workspaceId: Id, withArchived: boolean, signal?: AbortSignal): Promise<Hangar> {
  const { data, pagination } = await api.get<SetupModelView[]>(
    paths.workspaceModels(workspaceId, { limit: HANGAR_PAGE_SIZE, archived: withArchived ? 'include' : undefined }),
    signal,
  );
  const total = typeof pagination?.total === 'number' ? pagination.total : data.length;
  const archived = typeof pagination?.archived === 'number' ? pagination.archived : 0;
  return { models: data, total, archived };
}

/** Every hangar query of the workspace starts with this key, so one invalidation covers both lists. */
export const hangarQueryKey = (workspaceId: Id) => ['workspaces', workspaceId, 'models'] as const;

export function hangarQueryOptions(workspaceId: Id, withArchived = false) {
  return queryOptions({
    queryKey: [...hangarQueryKey(workspaceId), { archived: withArchived }],
    queryFn: ({ signal }) => listModels(workspaceId, withArchived, signal),
  });
}

/** The workspace's models with their latest revision and review state; archived ones only when asked. */
export function useHangar(workspaceId: Id | null, withArchived = false) {
  return useQuery({ ...hangarQueryOptions(workspaceId ?? '', withArchived), enabled: Boolean(workspaceId) });
}
