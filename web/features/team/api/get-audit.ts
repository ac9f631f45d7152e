import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Id } from '../../../types/api';
import type { AuditEvent } from '../types';

export const auditQueryKey = (workspaceId: Id) => ['workspaces', workspaceId, 'audit'] as const;

export interface AuditPage {
  events: AuditEvent[];
  total: number;
}

export async function getAudit(workspaceId: Id, signal?: AbortSignal): Promise<AuditPage> {
  const { data, pagination } = await api.get<AuditEvent[]>(`/api/workspaces/${encodeURIComponent(workspaceId)}/audit?limit=50`, signal);
  return { events: data, total: typeof pagination?.total === 'number' ? pagination.total : data.length };
}

export function auditQueryOptions(workspaceId: Id) {
  return queryOptions({ queryKey: auditQueryKey(workspaceId), queryFn: ({ signal }) => getAudit(workspaceId, signal) });
}

/** The newest audit events of a workspace; owners only, so it waits for `enabled`. */
export function useAudit(workspaceId: Id, enabled: boolean) {
  return useQuery({ ...auditQueryOptions(workspaceId), enabled });
}
