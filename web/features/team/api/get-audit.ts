import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Id } from '../../../types/api';
import type { AuditEvent } from '../types';

export const auditQueryKey = (workspaceId: Id) => ['workspaces', workspaceId, 'audit'] as const;

export interface AuditPage {
  events: AuditEvent[];
  total: number;
}

export async function getAudit(workspaceId: Id, limit: number, signal?: AbortSignal): Promise<AuditPage> {
  const { data, pagination } = await api.get<AuditEvent[]>(`/api/workspaces/${encodeURIComponent(workspaceId)}/audit?limit=${limit}`, signal);
  return { events: data, total: typeof pagination?.total === 'number' ? pagination.total : data.length };
}

export function auditQueryOptions(workspaceId: Id, limit: number) {
  return queryOptions({ queryKey: [...auditQueryKey(workspaceId), limit], queryFn: ({ signal }) => getAudit(workspaceId, limit, signal) });
}

/** The newest `limit` audit events of a workspace; owners only, so it waits for `enabled`. */
export function useAudit(workspaceId: Id, limit: number, enabled: boolean) {
  // While more is loading, the events already shown stay on screen.
  return useQuery({ ...auditQueryOptions(workspaceId, limit), enabled, placeholderData: keepPreviousData });
}
