import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { TextDiff } from '@shared/diff';
import type { Id } from '../../../types/api';
import type { CompareResult } from '../types';
import { paths } from '../../../lib/api-paths';

export async function getComparison(from: Id, to: Id, signal?: AbortSignal): Promise<CompareResult> {
  return (await api.get<CompareResult>(paths.compare({ from, to }), signal)).data;
}

export function comparisonQueryOptions(from: Id, to: Id) {
  return queryOptions({
    queryKey: ['compare', from, to],
    queryFn: ({ signal }) => getComparison(from, to, signal),
    // Two stored revisions never change, so neither does what differs between them.
    staleTime: Infinity,
  });
}

/** The compare of two revisions; keeps showing the last pair while a newly chosen one loads. */
export function useComparison(from: Id | null, to: Id | null) {
  return useQuery({
    ...comparisonQueryOptions(from ?? '', to ?? ''),
    enabled: Boolean(from && to),
    placeholderData: keepPreviousData,
  });
}

/** Where the browser downloads the RFC 6902 JSON Patch from `from` to `to`. */
export const patchDownloadUrl = (from: Id, to: Id) => paths.revisionPatch(to, { from, download: 1 });

export async function getTextDiff(from: Id, to: Id, signal?: AbortSignal): Promise<TextDiff> {
  return (await api.get<TextDiff>(paths.compareText({ from, to }), signal)).data;
}

/** The line-by-line diff of the two stored texts, fetched only once the reader opens it. */
export function useTextDiff(from: Id, to: Id, enabled: boolean) {
  return useQuery({
    queryKey: ['compare-text', from, to],
    queryFn: ({ signal }) => getTextDiff(from, to, signal),
    staleTime: Infinity,
    enabled,
  });
}
