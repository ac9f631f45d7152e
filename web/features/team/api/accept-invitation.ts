import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { useNavigate } from 'react-router-dom';
import type { Role, User } from '../../../types/api';
import { meQueryOptions } from '../../auth/api/get-me';
import type { InvitationPreview } from '../types';
import { paths } from '../../../lib/api-paths';

export async function getInvitation(token: string, signal?: AbortSignal): Promise<InvitationPreview> {
  return (await api.get<InvitationPreview>(paths.invitation(token), signal)).data;
}

export function invitationQueryOptions(token: string) {
  return queryOptions({
    queryKey: ['invitations', token],
    queryFn: ({ signal }) => getInvitation(token, signal),
    staleTime: Infinity,
  });
}

export function useInvitation(token: string) {
  return useQuery(invitationQueryOptions(token));
}

export interface AcceptAnswer {
  user: User;
  workspace: { id: string; name: string; role: Role };
}

/** Joins as the signed-in user, or with a name and password creates the invited account. */
export async function acceptInvitation(
  token: string,
  account?: { name: string; password: string },
): Promise<AcceptAnswer> {
  return (await api.post<AcceptAnswer>(paths.acceptInvitation(token), account ?? {})).data;
}

/**
 * Accepts, loads the session with the new workspace in it, then opens that workspace's
 * hangar. The navigation sits on the mutation itself so it happens even though the
 * page's own view changes as the session arrives.
 */
export function useAcceptInvitation(token: string) {
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  return useMutation({
    mutationFn: async (account?: { name: string; password: string }): Promise<AcceptAnswer> => {
      const answer = await acceptInvitation(token, account);
      await queryClient.fetchQuery({ ...meQueryOptions(), staleTime: 0 });
      return answer;
    },
    onSuccess: (answer) => navigate(`/w/${answer.workspace.id}/hangar`, { replace: true }),
  });
}
