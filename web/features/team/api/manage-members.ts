import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { SESSION_QUERY_KEY } from '../../../lib/query-client';
import type { Id, Member, Role } from '../../../types/api';
import { auditQueryKey } from './get-audit';
import { membersQueryOptions } from './get-members';
import { paths } from '../../../lib/api-paths';

const memberPath = (workspaceId: Id, userId: Id) => paths.workspaceMember(workspaceId, userId);

export async function changeRole(workspaceId: Id, userId: Id, role: Role): Promise<Member> {
  return (await api.patch<Member>(memberPath(workspaceId, userId), { role })).data;
}

export async function removeMember(workspaceId: Id, userId: Id): Promise<{ removed: boolean; left: boolean }> {
  return (await api.delete<{ removed: boolean; left: boolean }>(memberPath(workspaceId, userId))).data;
}

function useRefreshMembers(workspaceId: Id) {
  const queryClient = useQueryClient();
  return () => {
    void queryClient.invalidateQueries({ queryKey: membersQueryOptions(workspaceId).queryKey });
    void queryClient.invalidateQueries({ queryKey: auditQueryKey(workspaceId) });
    // The caller's own role may be the one that changed.
    void queryClient.invalidateQueries({ queryKey: SESSION_QUERY_KEY });
  };
}

export function useChangeRole(workspaceId: Id) {
  const refresh = useRefreshMembers(workspaceId);
  return useMutation({
    mutationFn: ({ userId, role }: { userId: Id; role: Role }) => changeRole(workspaceId, userId, role),
    onSuccess: refresh,
  });
}

export function useRemoveMember(workspaceId: Id) {
  const refresh = useRefreshMembers(workspaceId);
  return useMutation({ mutationFn: (userId: Id) => removeMember(workspaceId, userId), onSuccess: refresh });
}
