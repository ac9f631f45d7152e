import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, ApiError } from '../../../lib/api-client';
import { claimSavedAnswers } from '../../../lib/offline';
import { SESSION_QUERY_KEY } from '../../../lib/query-client';
import type { Session } from '../../../types/api';
import { paths } from '../../../lib/api-paths';
import { pageOf } from '../../../lib/paged';

/**
 * The session: `/api/session` answers 200 with null when signed out, so the first visit
 * logs no failed request; the screens still see signed-out as the 401 they handle.
 */
type SessionAnswer = Omit<Session, 'workspacesTotal'>;

export async function getMe(signal?: AbortSignal): Promise<Session> {
  const { data: session, pagination } = await api.get<SessionAnswer | null>(paths.session(), signal);
  await claimSavedAnswers(session?.user.id ?? null);
  if (!session) throw new ApiError(401, { code: 'signed-out', message: 'Sign in to continue.' });
  return { ...session, workspacesTotal: pageOf(session.workspaces, pagination, 0).total };
}

export const WORKSPACES_PAGE_SIZE = 100;

/** The next page of the user's workspaces, added to the session everyone reads. */
export function useMoreWorkspaces() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (offset: number) => {
      const { data, pagination } = await api.get<SessionAnswer>(paths.me({ limit: WORKSPACES_PAGE_SIZE, offset }));
      return pageOf(data.workspaces, pagination, offset);
    },
    onSuccess: (page) =>
      queryClient.setQueryData<Session>(SESSION_QUERY_KEY, (session) => {
        if (!session) return session;
        const known = new Set(session.workspaces.map((ws) => ws.id));
        const added = page.items.filter((ws) => !known.has(ws.id));
        return { ...session, workspaces: [...session.workspaces, ...added], workspacesTotal: page.total };
      }),
  });
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
