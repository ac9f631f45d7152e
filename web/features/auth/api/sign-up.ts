import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Session, User } from '../../../types/api';
import { meQueryOptions } from './get-me';
import { paths } from '../../../lib/api-paths';

export interface SignUpInput {
  email: string;
  name: string;
  password: string;
}

export async function signUp(input: SignUpInput): Promise<{ user: User }> {
  return (await api.post<{ user: User }>(paths.signUp(), input)).data;
}

/** Creating an account also signs in, so it ends with the new session loaded. */
export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: SignUpInput): Promise<Session> => {
      await signUp(input);
      queryClient.removeQueries();
      return queryClient.fetchQuery(meQueryOptions());
    },
  });
}
