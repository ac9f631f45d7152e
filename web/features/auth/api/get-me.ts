import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { SESSION_QUERY_KEY } from '../../../lib/query-client';
import type { Session } from '../../../types/api';

export async function getMe(signal?: AbortSignal): Promise<Session> {
  return (await api.get<Session>('/api/me', signal)).data;
}

export function meQueryOptions() {
  return queryOptions({
    queryKey: SESSION_QUERY_KEY,
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 5 * 60_000,
  });
}

/** The signed-in user and their workspaces; answers a 401 ApiError when signed out. */
export function useMe() {
  return useQuery(meQueryOptions());
}
