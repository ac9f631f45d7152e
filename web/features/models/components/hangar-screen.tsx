import { useDeferredValue, useMemo, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { LoadingState } from '../../../components/ui/loading-state';
import { PageHeader } from '../../../components/ui/page-header';
import { nextPageOf, ShowMore } from '../../../components/ui/show-more';
import { TextField } from '../../../components/ui/text-field';
import { useFollowingState } from '../../../hooks/use-following-state';
import { useQueryParams } from '../../../hooks/use-query-params';
import { useCurrentWorkspace } from '../../workspaces/hooks/use-current-workspace';
import { hangarOf, useHangar } from '../api/list-models';
import { canEdit } from '../permissions';
import { firstDirection, sortModels, type HangarColumn, type HangarSort } from '../sort-models';
import { HangarTable } from './hangar-table';
import { NewModelDialog } from './new-model-dialog';

const COLUMNS: HangarColumn[] = ['name', 'airframe', 'revision', 'checks', 'review', 'changed'];

// The sort and the search live in the address, so a filtered hangar can be shared or reloaded.
function sortFrom(params: URLSearchParams): HangarSort {
  const column = COLUMNS.find((name) => name === params.get('sort')) ?? 'name';
  const dir = params.get('dir');
  return { column, direction: dir === 'asc' ? 'ascending' : dir === 'desc' ? 'descending' : firstDirection(column) };
}

export function HangarScreen() {
  const { inUrl } = useCurrentWorkspace();
  const [params, update] = useQueryParams();
  const [creating, setCreating] = useState(false);
  const withArchived = params.get('archived') === 'show';
  const [archivedTicked, tickArchived] = useFollowingState(withArchived);
  const query = params.get('q') ?? '';
  // The server searches the whole hangar; the request follows the typing a beat behind.
  const deferredQuery = useDeferredValue(query.trim());
  const hangar = useHangar(inUrl?.id ?? null, { q: deferredQuery || undefined, withArchived });
  const { models, total, archived } = hangarOf(hangar.data?.pages);
  const { column, direction } = sortFrom(params);
  const searching = query.trim() !== '';

  const shown = useMemo(() => sortModels(models, { column, direction }), [models, column, direction]);

  if (!inUrl) return null;
  const editor = canEdit(inUrl.role);

  const newModel = editor ? (
    <Button onClick={() => setCreating(true)}>New model</Button>
  ) : (
    <p className="max-w-xs text-sm text-ink-700">
      Your role here is {inUrl.role}: you can read the models; owners and editors add them.
    </p>
  );

  return (
    <>
      <PageHeader
        title="Hangar"
        description={`The models of ${inUrl.name}, each with the checks of its latest revision and its review.`}
        actions={newModel}
      />
      {creating && <NewModelDialog workspace={inUrl} onClose={() => setCreating(false)} />}
      {hangar.isPending ? (
        <LoadingState label="Loading the hangar…" />
      ) : hangar.isError && !hangar.isFetchNextPageError ? (
        <ErrorState title="The hangar could not be loaded" error={hangar.error} onRetry={() => void hangar.refetch()} />
      ) : !searching && models.length === 0 && archived > 0 ? (
        <EmptyState
          title="Every model here is archived"
          action={
            <Button variant="secondary" onClick={() => update({ archived: 'show' })}>
              Show {archived} archived {archived === 1 ? 'model' : 'models'}
            </Button>
          }
        >
          Archived models are kept with their whole history; they are only left out of this list.
        </EmptyState>
      ) : !searching && models.length === 0 ? (
        <EmptyState
          title="No models in this hangar yet"
          action={editor ? <Button onClick={() => setCreating(true)}>Add the first model</Button> : undefined}
        >
          {editor
            ? 'Start from a blank setup, bring in a .yaml file, or fork a proven layout from another model.'
            : 'When an owner or editor adds a model, it appears here with its checks and review state.'}
        </EmptyState>
      ) : (
        <>
          <div className="mb-4 flex flex-wrap items-end gap-3">
            <TextField
              label="Search models"
              type="search"
              value={query}
              onChange={(event) => update({ q: event.target.value || null })}
              placeholder="Name, airframe or author"
              className="w-full max-w-sm"
            />
            <p className="pb-2 text-sm text-ink-700" aria-live="polite">
              {total} {total === 1 ? 'model' : 'models'}
              {searching ? (total === 1 ? ' matches' : ' match') : ''}
            </p>
            {(archived > 0 || withArchived) && (
              <label className="flex items-center gap-2 pb-2 text-sm text-ink-900">
                <input
                  type="checkbox"
                  className="size-4 accent-accent-700"
                  checked={archivedTicked}
                  onChange={(event) => {
                    tickArchived(event.target.checked);
                    update({ archived: event.target.checked ? 'show' : null });
                  }}
                />
                Show archived models ({archived})
              </label>
            )}
          </div>
          {shown.length === 0 ? (
            <EmptyState
              title={`No model matches “${query.trim()}”`}
              action={
                <Button variant="secondary" onClick={() => update({ q: null })}>
                  Clear the search
                </Button>
              }
            >
              The search looks at each model's name, airframe and the author of its latest revision, across the whole
              hangar.
            </EmptyState>
          ) : (
            <>
              <HangarTable
                models={shown}
                sort={{ column, direction }}
                onSort={(next) => update({ sort: next.column, dir: next.direction === 'ascending' ? 'asc' : 'desc' })}
              />
              {hangar.hasNextPage && !(column === 'name' && direction === 'ascending') && (
                <p className="mt-3 text-sm text-ink-700">
                  The heading sorts the {models.length} models shown; the hangar loads by name, a page at a time.
                </p>
              )}
            </>
          )}
          <ShowMore shown={models.length} total={total} noun="models" {...nextPageOf(hangar)} />
        </>
      )}
    </>
  );
}
