import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Id } from '../../../types/api';
import type { ShelfUnit, UnitHistory } from '../types';
import { paths } from '../../../lib/api-paths';

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

export async function getReceiverHistory(receiverId: Id, signal?: AbortSignal): Promise<UnitHistory> {
  return (await api.get<UnitHistory>(paths.receiverHistory(receiverId), signal)).data;
}

/** Where the unit has been, and every recorded change to it, newest first. */
export function useReceiverHistory(receiverId: Id) {
  return useQuery({
    queryKey: [...receiverQueryKey(receiverId), 'history'],
    queryFn: ({ signal }) => getReceiverHistory(receiverId, signal),
    enabled: receiverId !== '',
  });
}
