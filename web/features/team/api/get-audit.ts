import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Id } from '../../../types/api';
import type { AuditEvent } from '../types';
import { paths } from '../../../lib/api-paths';

export const AUDIT_PAGE_SIZE = 20;

export const auditQueryKey = (workspaceId: Id) => ['workspaces', workspaceId, 'audit'] as const;

export interface AuditPage {
  events: AuditEvent[];
  /** Where the next (older) page starts, null when this page reached the oldest event. */
  nextOffset: number | null;
  total: number;
}

export async function getAudit(workspaceId: Id, offset: number, signal?: AbortSignal): Promise<AuditPage> {
  const { data, pagination } = await api.get<AuditEvent[]>(
    paths.workspaceAudit(workspaceId, { limit: AUDIT_PAGE_SIZE, offset }),
    signal,
  );
  const total = typeof pagination?.total === 'number' ? pagination.total : offset + data.length;
  const end = offset + data.length;
  return { events: data, nextOffset: data.length > 0 && end < total ? end : null, total };
}

export function auditQueryOptions(workspaceId: Id) {
  return infiniteQueryOptions({
    queryKey: auditQueryKey(workspaceId),
    queryFn: ({ pageParam, signal }) => getAudit(workspaceId, pageParam, signal),
    initialPageParam: 0,
    getNextPageParam: (last) => last.nextOffset,
  });
}

/** The workspace's audit events, newest first, a page at a time (owners only). */
export function useAudit(workspaceId: Id) {
  return useInfiniteQuery(auditQueryOptions(workspaceId));
}

/**
 * Every event fetched so far, once each: events written while older pages were being
 * read push the offsets along, so a page can repeat the end of the one before it.
 */
export function auditEventsOf(pages: readonly AuditPage[] | undefined): AuditEvent[] {
  const byId = new Map<Id, AuditEvent>();
  for (const event of (pages ?? []).flatMap((page) => page.events)) if (!byId.has(event.id)) byId.set(event.id, event);
  return [...byId.values()];
}
