import {
  infiniteQueryOptions,
  keepPreviousData,
  queryOptions,
  useInfiniteQuery,
  useQuery,
} from '@tanstack/react-query';
import { getKeysetPage, itemsOf, keysetPaging, type KeysetPage } from '../../../lib/paged';
import type { Id } from '../../../types/api';
import type { SetupModelView } from '../types';
import { paths } from '../../../lib/api-paths';

// A hangar can hold thousands of models, so it is read a page at a time by name, and
// searched by the server: a model far down the list is found without loading the rest.
export const HANGAR_PAGE_SIZE = 50;
/** How many matches a model picker (install, fork) lists; typing more narrows them. */
export const PICKER_SIZE = 50;

export interface HangarFilter {
  /** Text the name, the airframe or the latest author's name contains, in any case. */
  q?: string;
  /** Archived models too. */
  withArchived?: boolean;
}

export function listModels(
  workspaceId: Id,
  { q, withArchived }: HangarFilter,
  { after, limit = HANGAR_PAGE_SIZE, signal }: { after?: string | null; limit?: number; signal?: AbortSignal } = {},
): Promise<KeysetPage<SetupModelView>> {
  return getKeysetPage<SetupModelView>(
    paths.workspaceModels(workspaceId, {
      limit,
      q: q || undefined,
      archived: withArchived ? 'include' : undefined,
      after,
    }),
    signal,
  );
}

/** Every hangar query of the workspace starts with this key, so one invalidation covers every list and picker. */
export const hangarQueryKey = (workspaceId: Id) => ['workspaces', workspaceId, 'models'] as const;

export function hangarQueryOptions(workspaceId: Id, filter: HangarFilter) {
  return infiniteQueryOptions({
    queryKey: [...hangarQueryKey(workspaceId), { q: filter.q ?? '', archived: Boolean(filter.withArchived) }],
    queryFn: ({ pageParam, signal }) => listModels(workspaceId, filter, { after: pageParam, signal }),
    ...keysetPaging,
    // While a new search of the same hangar is on its way the last answer stays on screen.
    placeholderData: (previous, previousQuery) => (previousQuery?.queryKey[1] === workspaceId ? previous : undefined),
  });
}

/** The workspace's models matching the search, by name, a page at a time; archived ones only when asked. */
export function useHangar(workspaceId: Id | null, filter: HangarFilter) {
  return useInfiniteQuery({ ...hangarQueryOptions(workspaceId ?? '', filter), enabled: Boolean(workspaceId) });
}

export interface Hangar {
  /** The models of the pages fetched so far. */
  models: SetupModelView[];
  /** How many models match the search in all. */
  total: number;
  /** How many archived models match the search (listed only when asked for). */
  archived: number;
}

/** What the fetched pages say together; the newest page's counts are the freshest. */
export function hangarOf(pages: readonly KeysetPage<SetupModelView>[] | undefined): Hangar {
  const last = pages?.at(-1);
  const archived = last?.pagination.archived;
  return { models: itemsOf(pages), total: last?.total ?? 0, archived: typeof archived === 'number' ? archived : 0 };
}

/** The first models matching what is typed into a picker: a picker never lists a whole hangar. */
export function useModelMatches(workspaceId: Id | null, q: string) {
  return useQuery({
    ...queryOptions({
      queryKey: [...hangarQueryKey(workspaceId ?? ''), 'matches', q],
      queryFn: ({ signal }) => listModels(workspaceId ?? '', { q }, { limit: PICKER_SIZE, signal }),
      placeholderData: keepPreviousData,
    }),
    enabled: Boolean(workspaceId),
  });
}
