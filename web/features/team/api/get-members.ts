import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Id, Member } from '../../../types/api';
import { paths } from '../../../lib/api-paths';

export async function getMembers(workspaceId: Id, signal?: AbortSignal): Promise<Member[]> {
  return (await api.get<Member[]>(paths.workspaceMembers(workspaceId), signal)).data;
}

export function membersQueryOptions(workspaceId: Id) {
  return queryOptions({
    queryKey: ['workspaces', workspaceId, 'members'],
    queryFn: ({ signal }) => getMembers(workspaceId, signal),
  });
}

export function useMembers(workspaceId: Id) {
  return useQuery(membersQueryOptions(workspaceId));
}
