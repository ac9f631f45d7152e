import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { paths } from '../../../lib/api-paths';

export interface PasswordResetRequest {
  email: string;
}

/** The server's own words about what happens next, shown to the user as they are. */
export async function requestPasswordReset(input: PasswordResetRequest): Promise<string | null> {
  const { data } = await api.post<unknown>(paths.passwordReset(), input);
  if (data && typeof data === 'object' && typeof (data as { message?: unknown }).message === 'string') {
    return (data as { message: string }).message;
  }
  return null;
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
