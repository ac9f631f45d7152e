import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { forgetSavedAnswers } from '../../../lib/offline';
import type { Session, User } from '../../../types/api';
import { meQueryOptions } from './get-me';
import { paths } from '../../../lib/api-paths';

export interface SignInInput {
  email: string;
  password: string;
}

export async function signIn(input: SignInInput): Promise<{ user: User; token: string }> {
  return (await api.post<{ user: User; token: string }>(paths.signIn(), input)).data;
}

/**
 * Signs in, then loads the new session (the answer to sign-in carries the user but not
 * the workspaces) so the caller can go straight to a workspace.
 */
export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: SignInInput): Promise<Session> => {
      await signIn(input);
      // Nothing saved on this device for an earlier session may show through.
      await forgetSavedAnswers();
      queryClient.removeQueries();
      return queryClient.fetchQuery(meQueryOptions());
    },
  });
}
