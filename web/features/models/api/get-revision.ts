import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Id } from '../../../types/api';
import type { Revision } from '../types';
import { paths } from '../../../lib/api-paths';

export async function getRevision(revisionId: Id, signal?: AbortSignal): Promise<Revision> {
  return (await api.get<Revision>(paths.revision(revisionId), signal)).data;
}

export const revisionQueryKey = (revisionId: Id) => ['revisions', revisionId] as const;

export function revisionQueryOptions(revisionId: Id) {
  return queryOptions({
    queryKey: revisionQueryKey(revisionId),
    queryFn: ({ signal }) => getRevision(revisionId, signal),
    // A revision never changes once stored, so what was fetched stays true.
    staleTime: Infinity,
  });
}

/** One revision in full (YAML, document, findings, tags); waits while `revisionId` is empty or null. */
export function useRevision(revisionId: Id | null | undefined) {
  return useQuery({ ...revisionQueryOptions(revisionId ?? ''), enabled: Boolean(revisionId) });
}

/** Where the browser downloads a revision's YAML text as a file. */
export const revisionDownloadUrl = (revisionId: Id) => paths.revision(revisionId, { format: 'yaml', download: 1 });
