import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Id } from '../../../types/api';
import type { ShelfStatus, ShelfUnit } from '../types';
import { paths } from '../../../lib/api-paths';

export interface ShelfFilter {
  q?: string;
  status?: ShelfStatus;
}

export interface ShelfPage {
  units: ShelfUnit[];
  total: number;
}

export const SHELF_PAGE_SIZE = 200;

export async function listReceivers(workspaceId: Id, filter: ShelfFilter, signal?: AbortSignal): Promise<ShelfPage> {
  const { data, pagination } = await api.get<ShelfUnit[]>(
    paths.workspaceReceivers(workspaceId, { limit: SHELF_PAGE_SIZE, q: filter.q || undefined, status: filter.status }),
    signal,
  );
  return { units: data, total: typeof pagination?.total === 'number' ? pagination.total : data.length };
}

export const shelfQueryKey = (workspaceId: Id) => ['workspaces', workspaceId, 'receivers'] as const;

export function shelfQueryOptions(workspaceId: Id, filter: ShelfFilter) {
  return queryOptions({
    queryKey: [...shelfQueryKey(workspaceId), filter.q ?? '', filter.status ?? 'all'],
    queryFn: ({ signal }) => listReceivers(workspaceId, filter, signal),
    // While a new search is on its way the last answer stays on screen.
    placeholderData: keepPreviousData,
  });
}

/** The workspace's receivers matching the search and the status filter. */
export function useShelf(workspaceId: Id | null, filter: ShelfFilter) {
  return useQuery({ ...shelfQueryOptions(workspaceId ?? '', filter), enabled: Boolean(workspaceId) });
}
