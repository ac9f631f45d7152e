import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ProvenanceEntry } from '@shared/contract/provenance';
import { api } from '../../../lib/api-client';
import { paths } from '../../../lib/api-paths';
import type { Id } from '../../../types/api';

export async function getProvenance(modelId: Id, revisionId: Id, signal?: AbortSignal): Promise<ProvenanceEntry[]> {
  return (await api.get<ProvenanceEntry[]>(paths.modelProvenance(modelId, { revision: revisionId }), signal)).data;
}

export function provenanceQueryOptions(modelId: Id, revisionId: Id) {
  return queryOptions({
    queryKey: ['provenance', modelId, revisionId] as const,
    queryFn: ({ signal }) => getProvenance(modelId, revisionId, signal),
    // Where a stored revision's values came from never changes.
    staleTime: Infinity,
    select: (entries) => new Map(entries.map((entry) => [entry.path, entry])),
  });
}

/** Where each leaf setting of one revision came from, by identity path; waits for both ids. */
export function useProvenance(modelId: Id | null | undefined, revisionId: Id | null | undefined) {
  return useQuery({
    ...provenanceQueryOptions(modelId ?? '', revisionId ?? ''),
    enabled: Boolean(modelId && revisionId),
  });
}
