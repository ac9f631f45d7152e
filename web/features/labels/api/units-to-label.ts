import { useQueries } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import type { Id } from '../../../types/api';
import { receiverQueryOptions } from '../../shelf/api/get-receiver';
import { shelfOf, useShelf } from '../../shelf/api/list-receivers';
import type { ShelfUnit } from '../../shelf/types';

// The API's largest page: a sheet for every unit is read in as few requests as it can be.
const WHOLE_SHELF_PAGE = 200;
/** The most units one address picks, each read by its id; the sheet says when more were picked. */
export const MOST_PICKED = 200;

export interface UnitsToLabel {
  units: ShelfUnit[];
  /** How many units the sheet is for once every one is read. */
  total: number;
  pending: boolean;
  error: unknown;
  retry: () => void;
  /** The whole shelf has more units than are read so far; `readAll` reads them, a page after another. */
  more: boolean;
  readAll: () => void;
  readingAll: boolean;
}

/**
 * The units a label sheet is for: those the address picks, each read by its id, or else
 * the shelf, whose first page is read at once and the rest only when asked for, one page
 * after another, so a shelf of thousands is never fetched by surprise.
 */
export function useUnitsToLabel(workspaceId: Id | null, picked: readonly Id[] | null): UnitsToLabel {
  const chosen = useQueries({
    queries: (picked ?? []).slice(0, MOST_PICKED).map((id) => receiverQueryOptions(id)),
  });
  const shelf = useShelf(picked ? null : workspaceId, {}, WHOLE_SHELF_PAGE);
  const [readingAll, setReadingAll] = useState(false);
  const { hasNextPage, isFetchingNextPage, isFetchNextPageError, fetchNextPage } = shelf;

  useEffect(() => {
    if (readingAll && hasNextPage && !isFetchingNextPage && !isFetchNextPageError) void fetchNextPage();
  }, [readingAll, hasNextPage, isFetchingNextPage, isFetchNextPageError, fetchNextPage]);

  if (picked) {
    const failed = chosen.find((query) => query.isError);
    const units = chosen.flatMap((query) => (query.data ? [query.data] : []));
    return {
      units,
      total: chosen.length,
      pending: chosen.some((query) => query.isPending),
      error: failed?.error ?? null,
      retry: () => chosen.forEach((query) => void query.refetch()),
      more: false,
      readAll: () => undefined,
      readingAll: false,
    };
  }
  const { units, total } = shelfOf(shelf.data?.pages);
  return {
    units,
    total,
    pending: shelf.isPending,
    error: shelf.error,
    retry: () => void (shelf.isFetchNextPageError ? shelf.fetchNextPage() : shelf.refetch()),
    more: hasNextPage,
    readAll: () => setReadingAll(true),
    readingAll: readingAll && hasNextPage && !isFetchNextPageError,
  };
}
