import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Session, User } from '../../../types/api';
import { meQueryOptions } from './get-me';
import { paths } from '../../../lib/api-paths';

export async function checkResetLink(token: string, signal?: AbortSignal): Promise<{ email: string }> {
  return (await api.get<{ email: string }>(paths.passwordResetLink(token), signal)).data;
}

export function resetLinkQueryOptions(token: string) {
  return queryOptions({
    queryKey: ['password-reset', token],
    queryFn: ({ signal }) => checkResetLink(token, signal),
    staleTime: Infinity,
  });
}

/** Whether a reset link still works, and for which address. */
export function useResetLink(token: string) {
  return useQuery(resetLinkQueryOptions(token));
}

export async function confirmPasswordReset(token: string, password: string): Promise<{ user: User; token: string }> {
  return (await api.post<{ user: User; token: string }>(paths.passwordResetLink(token), { password })).data;
}

/** Sets the new password (which ends every other session) and loads the fresh session. */
export function useConfirmPasswordReset(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (password: string): Promise<Session> => {
      await confirmPasswordReset(token, password);
      queryClient.removeQueries();
      return queryClient.fetchQuery(meQueryOptions());
    },
  });
}
