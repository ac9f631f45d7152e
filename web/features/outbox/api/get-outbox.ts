import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { OutboxMessage } from '../types';
import { paths } from '../../../lib/api-paths';

export interface OutboxPage {
  messages: OutboxMessage[];
  total: number;
}

export async function getOutbox(signal?: AbortSignal): Promise<OutboxPage> {
  const { data, pagination } = await api.get<OutboxMessage[]>(paths.outbox({ limit: 100 }), signal);
  return { messages: data, total: typeof pagination?.total === 'number' ? pagination.total : data.length };
}

export function outboxQueryOptions() {
  // Mail arrives while the screen is open (someone invites, a review is asked for).
  return queryOptions({
    queryKey: ['outbox'],
    queryFn: ({ signal }) => getOutbox(signal),
    staleTime: 0,
    refetchInterval: 10_000,
  });
}

export function useOutbox() {
  return useQuery(outboxQueryOptions());
}
