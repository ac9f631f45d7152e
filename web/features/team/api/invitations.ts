import { infiniteQueryOptions, useInfiniteQuery, useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Id, Role } from '../../../types/api';
import type { Invitation } from '../types';
import { auditQueryKey } from './get-audit';
import { paths } from '../../../lib/api-paths';
import { getPage, offsetPaging, type Page } from '../../../lib/paged';

export const invitationsQueryKey = (workspaceId: Id) => ['workspaces', workspaceId, 'invitations'] as const;

export const INVITATIONS_PAGE_SIZE = 50;

export function listInvitations(workspaceId: Id, offset: number, signal?: AbortSignal): Promise<Page<Invitation>> {
  const path = paths.workspaceInvitations(workspaceId, { limit: INVITATIONS_PAGE_SIZE, offset });
  return getPage<Invitation>(path, offset, signal);
}

export function invitationsQueryOptions(workspaceId: Id) {
  return infiniteQueryOptions({
    queryKey: invitationsQueryKey(workspaceId),
    queryFn: ({ pageParam, signal }) => listInvitations(workspaceId, pageParam, signal),
    ...offsetPaging,
  });
}

/** Pending invitations, newest first, a page at a time; only owners may read them, so the query waits for `enabled`. */
export function useInvitations(workspaceId: Id, enabled: boolean) {
  return useInfiniteQuery({ ...invitationsQueryOptions(workspaceId), enabled });
}

export interface InviteInput {
  email: string;
  role: Role;
}

export async function inviteMember(workspaceId: Id, input: InviteInput): Promise<Invitation> {
  return (await api.post<Invitation>(paths.workspaceInvitations(workspaceId), input)).data;
}

export async function revokeInvitation(workspaceId: Id, invitationId: Id): Promise<Invitation> {
  return (await api.delete<Invitation>(paths.workspaceInvitation(workspaceId, invitationId))).data;
}

function useRefreshTeam(workspaceId: Id) {
  const queryClient = useQueryClient();
  return () => {
    void queryClient.invalidateQueries({ queryKey: invitationsQueryKey(workspaceId) });
    void queryClient.invalidateQueries({ queryKey: auditQueryKey(workspaceId) });
  };
}

export function useInviteMember(workspaceId: Id) {
  const refresh = useRefreshTeam(workspaceId);
  return useMutation({ mutationFn: (input: InviteInput) => inviteMember(workspaceId, input), onSuccess: refresh });
}

export function useRevokeInvitation(workspaceId: Id) {
  const refresh = useRefreshTeam(workspaceId);
  return useMutation({
    mutationFn: (invitationId: Id) => revokeInvitation(workspaceId, invitationId),
    onSuccess: refresh,
  });
}
