import { queryOptions, useInfiniteQuery, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Id } from '../../../types/api';
import type { ShelfUnit, UnitHistory } from '../types';
import { paths } from '../../../lib/api-paths';
import { pageOf } from '../../../lib/paged';

export const receiverQueryKey = (receiverId: Id) => ['receivers', receiverId] as const;

export async function getReceiver(receiverId: Id, signal?: AbortSignal): Promise<ShelfUnit> {
  return (await api.get<ShelfUnit>(paths.receiver(receiverId), signal)).data;
}

export function receiverQueryOptions(receiverId: Id) {
  return queryOptions({
    queryKey: receiverQueryKey(receiverId),
    queryFn: ({ signal }) => getReceiver(receiverId, signal),
  });
}

/** One unit: its record, stored settings, where it is and whether it is ready there. */
export function useReceiver(receiverId: Id) {
  return useQuery({ ...receiverQueryOptions(receiverId), enabled: receiverId !== '' });
}

export const HISTORY_PAGE_SIZE = 50;

/** Where each of the history's two lists goes on from; null for a list already read to its end. */
export interface HistoryOffsets {
  installs: number | null;
  events: number | null;
}

const FIRST_HISTORY_PAGE: HistoryOffsets = { installs: 0, events: 0 };

export interface HistoryPage extends UnitHistory {
  totals: { installs: number; events: number };
  next: HistoryOffsets | null;
}

export async function getReceiverHistory(
  receiverId: Id,
  offsets: HistoryOffsets,
  signal?: AbortSignal,
): Promise<HistoryPage> {
  const path = paths.receiverHistory(receiverId, {
    limit: HISTORY_PAGE_SIZE,
    installs_offset: offsets.installs,
    events_offset: offsets.events,
  });
  const { data, pagination } = await api.get<UnitHistory>(path, signal);
  const paging = (pagination ?? {}) as { installs?: unknown; events?: unknown };
  // A list already read to its end is not asked for again (its first page comes back and is left out).
  const installs = offsets.installs === null ? [] : data.installs;
  const events = offsets.events === null ? [] : data.events;
  const installsPage = pageOf(installs, paging.installs, offsets.installs ?? 0);
  const eventsPage = pageOf(events, paging.events, offsets.events ?? 0);
  const next = { installs: installsPage.nextOffset, events: eventsPage.nextOffset };
  return {
    installs,
    events,
    totals: { installs: installsPage.total, events: eventsPage.total },
    next: next.installs === null && next.events === null ? null : next,
  };
}

/** Where the unit has been, and every recorded change to it, newest first, older pages of both on request. */
export function useReceiverHistory(receiverId: Id) {
  return useInfiniteQuery({
    queryKey: [...receiverQueryKey(receiverId), 'history'],
    queryFn: ({ pageParam, signal }) => getReceiverHistory(receiverId, pageParam, signal),
    initialPageParam: FIRST_HISTORY_PAGE,
    getNextPageParam: (last) => last.next,
    enabled: receiverId !== '',
  });
}
