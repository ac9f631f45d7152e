import { nextOffset, type OffsetPagination } from '@shared/contract/paging';
import { api } from './api-client';

// A list the API answers a page at a time (`{ data, pagination: { limit, offset, total } }`),
// as TanStack Query's infinite queries read it: each page knows where the next begins.

export interface Page<T> {
  items: T[];
  total: number;
  /** The offset of the next page; null when this one reached the end. */
  nextOffset: number | null;
}

export function pageOf<T>(items: T[], pagination: unknown, offset: number): Page<T> {
  const given = pagination as Partial<OffsetPagination> | undefined;
  const total = typeof given?.total === 'number' ? given.total : offset + items.length;
  const known: OffsetPagination = { limit: given?.limit ?? items.length, offset, total };
  return { items, total, nextOffset: nextOffset(known, items.length) };
}

/** GETs one page of a list; `path` already carries its limit and offset. */
export async function getPage<T>(path: string, offset: number, signal?: AbortSignal): Promise<Page<T>> {
  const { data, pagination } = await api.get<T[]>(path, signal);
  return pageOf(data, pagination, offset);
}

/** Options every offset-paged infinite query shares. */
export const offsetPaging = {
  initialPageParam: 0,
  getNextPageParam: (last: { nextOffset: number | null }) => last.nextOffset,
};

/** Everything fetched so far, once each (a row added meanwhile can push one onto the next page twice). */
export function itemsOf<T extends { id: string }>(pages: readonly { items: T[] }[] | undefined): T[] {
  const byId = new Map<string, T>();
  for (const item of (pages ?? []).flatMap((page) => page.items)) if (!byId.has(item.id)) byId.set(item.id, item);
  return [...byId.values()];
}

/** The total the newest page reports. */
export const totalOf = (pages: readonly { total: number }[] | undefined): number => pages?.at(-1)?.total ?? 0;

// The hangar and the shelf page by cursor instead (`?after=` the id of the last entry,
// answered as `pagination.next_after`): a page deep into a large workspace is an index
// range read on the server, where an offset would walk every entry before it.

export interface KeysetPage<T> {
  items: T[];
  total: number;
  /** The `after` of the next page; null when this one reached the end. */
  nextAfter: string | null;
  /** The answer's pagination as sent, for lists that say more (the hangar's archived count). */
  pagination: Record<string, unknown>;
}

/** GETs one page of a cursor-paged list; `path` already carries its limit, search and `after`. */
export async function getKeysetPage<T>(path: string, signal?: AbortSignal): Promise<KeysetPage<T>> {
  const { data, pagination = {} } = await api.get<T[]>(path, signal);
  const next = pagination.next_after;
  return {
    items: data,
    total: typeof pagination.total === 'number' ? pagination.total : data.length,
    nextAfter: typeof next === 'string' ? next : null,
    pagination,
  };
}

/** Options every cursor-paged infinite query shares. */
export const keysetPaging = {
  initialPageParam: null as string | null,
  getNextPageParam: (last: { nextAfter: string | null }) => last.nextAfter,
};
