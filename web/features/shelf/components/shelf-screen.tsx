import { useDeferredValue, useState } from 'react';
import { Link } from 'react-router-dom';
import { Button, buttonClasses } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { LoadingState } from '../../../components/ui/loading-state';
import { PageHeader } from '../../../components/ui/page-header';
import { nextPageOf, ShowMore } from '../../../components/ui/show-more';
import { TextField } from '../../../components/ui/text-field';
import { useQueryParams } from '../../../hooks/use-query-params';
import { cx } from '../../../lib/cx';
import { canEdit } from '../../models/permissions';
import { useCurrentWorkspace } from '../../workspaces/hooks/use-current-workspace';
import { shelfOf, useShelf } from '../api/list-receivers';
import type { ShelfStatus } from '../types';
import { AddReceiverDialog } from './add-receiver-dialog';
import { ShelfTable } from './shelf-table';

const FILTERS: { value: ShelfStatus | null; label: string }[] = [
  { value: null, label: 'All' },
  { value: 'installed', label: 'Installed' },
  { value: 'free', label: 'Free' },
];

const statusFrom = (value: string | null): ShelfStatus | null =>
  value === 'installed' || value === 'free' ? value : null;

export function ShelfScreen() {
  const { inUrl } = useCurrentWorkspace();
  const [params, update] = useQueryParams();
  const [adding, setAdding] = useState(false);
  const query = params.get('q') ?? '';
  const status = statusFrom(params.get('status'));
  // The list follows the typing a beat behind, so each key press does not cost a request.
  const deferredQuery = useDeferredValue(query.trim());
  const shelf = useShelf(inUrl?.id ?? null, { q: deferredQuery || undefined, status: status ?? undefined });
  const { units, total } = shelfOf(shelf.data?.pages);

  if (!inUrl) return null;
  const editor = canEdit(inUrl.role);
  const filtered = Boolean(query.trim() || status);

  return (
    <>
      <PageHeader
        title="Shelf"
        documentTitle={`Shelf · ${inUrl.name}`}
        description={`The receivers of ${inUrl.name}: the mark on each case, the settings each unit holds and where it is flying.`}
        actions={
          <>
            <Link to={`/w/${inUrl.id}/shelf/labels`} className={buttonClasses('secondary')}>
              Print labels
            </Link>
            {editor ? (
              <Button onClick={() => setAdding(true)}>Add receiver</Button>
            ) : (
              <p className="max-w-xs text-sm text-ink-700">
                Your role here is {inUrl.role}: you can read the shelf; owners and editors change it.
              </p>
            )}
          </>
        }
      />
      {adding && <AddReceiverDialog workspace={inUrl} onClose={() => setAdding(false)} />}

      <div className="mb-4 flex flex-wrap items-end gap-x-4 gap-y-3">
        <TextField
          label="Search receivers"
          type="search"
          value={query}
          onChange={(event) => update({ q: event.target.value || null })}
          placeholder="Label, mark, notes or short code"
          className="w-full max-w-sm"
        />
        <fieldset>
          <legend className="text-sm font-medium text-ink-900">Show</legend>
          <div className="mt-1.5 inline-flex rounded-md border border-ply-500 bg-paper-raised p-0.5">
            {FILTERS.map((filter) => {
              const active = status === filter.value;
              return (
                <label
                  key={filter.label}
                  className={cx(
                    'cursor-pointer rounded-sm px-3 py-1.5 text-base has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-accent-600',
                    active ? 'bg-accent-700 font-medium text-white' : 'text-ink-700 hover:bg-ply-100',
                  )}
                >
                  <input
                    type="radio"
                    name="shelf-status"
                    className="sr-only"
                    checked={active}
                    onChange={() => update({ status: filter.value })}
                  />
                  {filter.label}
                </label>
              );
            })}
          </div>
        </fieldset>
        {shelf.data && (
          <p className="pb-2 text-sm text-ink-700" aria-live="polite">
            {total} {total === 1 ? 'receiver' : 'receivers'}
            {filtered ? ' match' : ''}
          </p>
        )}
      </div>

      {shelf.isPending ? (
        <LoadingState label="Loading the shelf…" />
      ) : shelf.isError && !shelf.isFetchNextPageError ? (
        <ErrorState title="The shelf could not be loaded" error={shelf.error} onRetry={() => void shelf.refetch()} />
      ) : units.length === 0 ? (
        filtered ? (
          <EmptyState
            title="No receiver matches"
            action={
              <Button variant="secondary" onClick={() => update({ q: null, status: null })}>
                Show every receiver
              </Button>
            }
          >
            The search looks at each unit’s label, the mark on its case, its notes and the short code on its label.
          </EmptyState>
        ) : (
          <EmptyState
            title="The shelf is empty"
            action={editor ? <Button onClick={() => setAdding(true)}>Add the first receiver</Button> : undefined}
          >
            Add each physical receiver with the mark on its case, so the club knows which unit holds which settings.
          </EmptyState>
        )
      ) : (
        <>
          <ShelfTable units={units} workspaceId={inUrl.id} />
          <ShowMore shown={units.length} total={total} noun="receivers" {...nextPageOf(shelf)} />
        </>
      )}
    </>
  );
}
