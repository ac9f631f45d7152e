import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import { api, isUnauthorized } from '../../../lib/api-client';
import { paths } from '../../../lib/api-paths';
import { forgetSavedAnswers } from '../../../lib/offline';

export async function signOut(): Promise<void> {
  try {
    await api.post<unknown>(paths.signOut());
  } catch (error) {
    // A session that already expired is as signed out as it gets.
    if (!isUnauthorized(error)) throw error;
  }
}

/**
 * Signs out, forgets every answer this device saved for working offline, leaves for
 * the sign-in page and empties the in-memory cache.
 */
export function useSignOut() {
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  return useMutation({
    mutationFn: signOut,
    onSuccess: async () => {
      await forgetSavedAnswers();
      await navigate('/sign-in', { replace: true });
      queryClient.clear();
    },
  });
}
