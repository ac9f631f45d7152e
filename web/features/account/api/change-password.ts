import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { SESSION_QUERY_KEY } from '../../../lib/query-client';
import type { User } from '../../../types/api';
import { paths } from '../../../lib/api-paths';

export interface PasswordChange {
  current: string;
  password: string;
}

export async function changePassword(input: PasswordChange): Promise<{ user: User; token: string }> {
  return (await api.post<{ user: User; token: string }>(paths.password(), input)).data;
}

/**
 * Changes the password; the server ends every session of the account and hands this
 * browser a fresh cookie, so the session is simply read again.
 */
export function useChangePassword() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: changePassword,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: SESSION_QUERY_KEY }),
  });
}
