import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import { api } from '../../../lib/api-client';
import { paths } from '../../../lib/api-paths';

export async function signOutEverywhere(): Promise<void> {
  await api.post<unknown>(paths.signOutEverywhere());
}

/** Ends every session of the account, this one included, and leaves for the sign-in page. */
export function useSignOutEverywhere() {
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  return useMutation({
    mutationFn: signOutEverywhere,
    onSuccess: async () => {
      await navigate('/sign-in', { replace: true });
      queryClient.clear();
    },
  });
}
