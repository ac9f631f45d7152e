import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, ApiError } from '../../../lib/api-client';
import { claimSavedAnswers } from '../../../lib/offline';
import { SESSION_QUERY_KEY } from '../../../lib/query-client';
import type { Session } from '../../../types/api';

/**
 * The session: `/api/session` answers 200 with null when signed out, so the first visit
 * logs no failed request; the screens still see signed-out as the 401 they handle.
 */
export async function getMe(signal?: AbortSignal): Promise<Session> {
  const session = (await api.get<Session | null>('/api/session', signal)).data;
  await claimSavedAnswers(session?.user.id ?? null);
  if (!session) throw new ApiError(401, { code: 'signed-out', message: 'Sign in to continue.' });
  return session;
}

export function meQueryOptions() {
  return queryOptions({
    queryKey: SESSION_QUERY_KEY,
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 5 * 60_000,
  });
}

/** The signed-in user and their workspaces; a 401 ApiError (made here, not by the server) when signed out. */
export function useMe() {
  return useQuery(meQueryOptions());
}
