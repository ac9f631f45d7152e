import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { getKeysetPage, itemsOf, keysetPaging, type KeysetPage } from '../../../lib/paged';
import type { Id } from '../../../types/api';
import type { ShelfStatus, ShelfUnit } from '../types';
import { paths } from '../../../lib/api-paths';

export interface ShelfFilter {
  q?: string;
  status?: ShelfStatus;
}

// A shelf can hold thousands of units, so it is read a page at a time by label, and
// searched by the server (label, mark, notes, the short code on a case).
export const SHELF_PAGE_SIZE = 50;

export function listReceivers(
  workspaceId: Id,
  filter: ShelfFilter,
  { after, limit = SHELF_PAGE_SIZE, signal }: { after?: string | null; limit?: number; signal?: AbortSignal } = {},
): Promise<KeysetPage<ShelfUnit>> {
  return getKeysetPage<ShelfUnit>(
    paths.workspaceReceivers(workspaceId, { limit, q: filter.q || undefined, status: filter.status, after }),
    signal,
  );
}

export const shelfQueryKey = (workspaceId: Id) => ['workspaces', workspaceId, 'receivers'] as const;

export function shelfQueryOptions(workspaceId: Id, filter: ShelfFilter, limit = SHELF_PAGE_SIZE) {
  return infiniteQueryOptions({
    queryKey: [...shelfQueryKey(workspaceId), filter.q ?? '', filter.status ?? 'all', limit],
    queryFn: ({ pageParam, signal }) => listReceivers(workspaceId, filter, { after: pageParam, limit, signal }),
    ...keysetPaging,
    // While a new search of the same shelf is on its way the last answer stays on screen.
    placeholderData: (previous, previousQuery) => (previousQuery?.queryKey[1] === workspaceId ? previous : undefined),
  });
}

/** The workspace's receivers matching the search and the status filter, by label, `limit` at a time. */
export function useShelf(workspaceId: Id | null, filter: ShelfFilter, limit = SHELF_PAGE_SIZE) {
  return useInfiniteQuery({ ...shelfQueryOptions(workspaceId ?? '', filter, limit), enabled: Boolean(workspaceId) });
}

/** The units of the pages fetched so far and how many match in all. */
export function shelfOf(pages: readonly KeysetPage<ShelfUnit>[] | undefined): { units: ShelfUnit[]; total: number } {
  return { units: itemsOf(pages), total: pages?.at(-1)?.total ?? 0 };
}
