import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Id } from '../../../types/api';
import type { RevisionSummary } from '../types';
import { paths } from '../../../lib/api-paths';

export const REVISIONS_PAGE_SIZE = 50;

export interface RevisionsPage {
  revisions: RevisionSummary[];
  /** The `before` to ask for the next (older) page, null when this page reached revision 1. */
  nextBefore: number | null;
}

export async function listRevisions(
  modelId: Id,
  { before, limit = REVISIONS_PAGE_SIZE, signal }: { before?: number; limit?: number; signal?: AbortSignal } = {},
): Promise<RevisionsPage> {
  const { data, pagination } = await api.get<RevisionSummary[]>(
    paths.modelRevisions(modelId, { limit, before }),
    signal,
  );
  const next = pagination?.next_before;
  return { revisions: data, nextBefore: typeof next === 'number' ? next : null };
}

export const revisionsQueryKey = (modelId: Id) => ['models', modelId, 'revisions'] as const;

export function revisionsQueryOptions(modelId: Id) {
  return infiniteQueryOptions({
    queryKey: revisionsQueryKey(modelId),
    queryFn: ({ pageParam, signal }) => listRevisions(modelId, { before: pageParam ?? undefined, signal }),
    initialPageParam: null as number | null,
    getNextPageParam: (last) => last.nextBefore,
  });
}

/** The model's history, newest first, a page at a time; `data.pages` holds what was fetched. */
export function useRevisions(modelId: Id) {
  return useInfiniteQuery({ ...revisionsQueryOptions(modelId), enabled: modelId !== '' });
}

/** All revisions fetched so far, in one list. */
export const revisionsOf = (pages: readonly RevisionsPage[] | undefined): RevisionSummary[] =>
  pages?.flatMap((page) => page.revisions) ?? [];
