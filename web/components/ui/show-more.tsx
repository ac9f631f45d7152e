import { Button } from './button';
import { ErrorState } from './error-state';

export interface ShowMoreProps {
  /** How many are on screen, and how many there are in all. */
  shown: number;
  total: number;
  /** What is counted, plural: "reviews", "invitations". */
  noun: string;
  hasMore: boolean;
  pending: boolean;
  error?: unknown;
  onMore: () => void;
  /** The button's words; "Show more" when left out. */
  label?: string;
}

/** Under a paged list with more to come: how many are shown of how many, and the way to fetch the next page. */
export function ShowMore({ shown, total, noun, hasMore, pending, error, onMore, label = 'Show more' }: ShowMoreProps) {
  const failed = error !== undefined && error !== null;
  if (!hasMore && !failed) return null;
  return (
    <div className="mt-3 space-y-2">
      {failed && <ErrorState title={`More ${noun} could not be loaded`} error={error} onRetry={onMore} />}
      <div className="flex flex-wrap items-center gap-3">
        <Button variant="secondary" size="sm" pending={pending} onClick={onMore}>
          {label}
        </Button>
        <span className="text-sm text-ink-700">
          Showing {shown} of {total} {noun}.
        </span>
      </div>
    </div>
  );
}

/** What a React Query infinite list tells ShowMore: whether more pages follow, the fetch under way, its failure and how to ask. */
export function nextPageOf(query: {
  hasNextPage: boolean;
  isFetchingNextPage: boolean;
  isFetchNextPageError: boolean;
  error: unknown;
  fetchNextPage: () => Promise<unknown>;
}): Pick<ShowMoreProps, 'hasMore' | 'pending' | 'error' | 'onMore'> {
  return {
    hasMore: query.hasNextPage,
    pending: query.isFetchingNextPage,
    error: query.isFetchNextPageError ? query.error : undefined,
    onMore: () => void query.fetchNextPage(),
  };
}
