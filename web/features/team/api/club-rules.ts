import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ClubRulesView } from '@shared/contract/club-rules';
import type { ClubRules } from '@shared/rules/club-rules';
import { api } from '../../../lib/api-client';
import { paths } from '../../../lib/api-paths';
import type { Id } from '../../../types/api';

export const clubRulesQueryKey = (workspaceId: Id) => ['club-rules', workspaceId] as const;

export async function getClubRules(workspaceId: Id, signal?: AbortSignal): Promise<ClubRulesView> {
  return (await api.get<ClubRulesView>(paths.workspaceRules(workspaceId), signal)).data;
}

export function clubRulesQueryOptions(workspaceId: Id) {
  return queryOptions({
    queryKey: clubRulesQueryKey(workspaceId),
    queryFn: ({ signal }) => getClubRules(workspaceId, signal),
  });
}

export function useClubRules(workspaceId: Id) {
  return useQuery(clubRulesQueryOptions(workspaceId));
}

export async function putClubRules(workspaceId: Id, rules: ClubRules): Promise<ClubRulesView> {
  return (await api.put<ClubRulesView>(paths.workspaceRules(workspaceId), rules)).data;
}

/**
 * Saves the rules. Every count, finding and review state in the workspace follows the
 * rules in force now, so everything fetched so far is fetched again.
 */
export function useSaveClubRules(workspaceId: Id) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (rules: ClubRules) => putClubRules(workspaceId, rules),
    onSuccess: async (saved) => {
      queryClient.setQueryData(clubRulesQueryKey(workspaceId), saved);
      await queryClient.invalidateQueries({ predicate: (query) => query.queryKey[0] !== 'club-rules' });
    },
  });
}
