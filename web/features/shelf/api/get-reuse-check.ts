import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Id } from '../../../types/api';
import type { ReuseCheckView } from '../types';
import { receiverQueryKey } from './get-receiver';
import { paths } from '../../../lib/api-paths';

export async function getReuseCheck(
  receiverId: Id,
  modelId: Id,
  slot: string,
  signal?: AbortSignal,
): Promise<ReuseCheckView> {
  return (await api.get<ReuseCheckView>(paths.receiverReuseCheck(receiverId, { model: modelId, slot }), signal)).data;
}

export function reuseCheckQueryOptions(receiverId: Id, modelId: Id, slot: string) {
  return queryOptions({
    queryKey: [...receiverQueryKey(receiverId), 'reuse-check', modelId, slot],
    queryFn: ({ signal }) => getReuseCheck(receiverId, modelId, slot, signal),
  });
}

/** What must change on the unit before it flies in that slot of the model's latest revision. */
export function useReuseCheck(receiverId: Id, target: { modelId: Id; slot: string } | null) {
  return useQuery({
    ...reuseCheckQueryOptions(receiverId, target?.modelId ?? '', target?.slot ?? ''),
    enabled: Boolean(receiverId && target?.modelId && target.slot),
  });
}
