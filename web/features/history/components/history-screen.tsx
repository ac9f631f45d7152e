import { useState, type ReactNode } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { LoadingState } from '../../../components/ui/loading-state';
import { PageHeader } from '../../../components/ui/page-header';
import { cx } from '../../../lib/cx';
import { useSession } from '../../auth/hooks/use-session';
import { useModel } from '../../models/api/get-model';
import { revisionsOf, useRevisions } from '../../models/api/list-revisions';
import { canEdit } from '../../models/permissions';
import type { RevisionSummary, SetupModelView } from '../../models/types';
import { comparePair, compareSearch, togglePick } from '../pick-two';
import { ExportHistoryLink } from './export-history-link';
import { ForkDialog } from './fork-dialog';
import { RevertDialog } from './revert-dialog';
import { CARD_INSET, RevisionTimeline } from './revision-timeline';

export function HistoryScreen() {
  const { modelId = '' } = useParams();
  const model = useModel(modelId);

  let body: ReactNode;
  if (model.isPending) body = <LoadingState label="Loading the history…" />;
  else if (model.isError)
    body = (
      <ErrorState title="This model could not be loaded" error={model.error} onRetry={() => void model.refetch()} />
    );
  else body = <History model={model.data} />;

  return (
    <>
      <PageHeader
        title="History"
        documentTitle={model.data ? `History · ${model.data.name}` : 'History'}
        description="Every revision of this model, newest first. Pick two to compare them; nothing here is ever changed or deleted."
        actions={model.data && <ExportHistoryLink modelId={model.data.id} />}
      />
      {body}
    </>
  );
}

function History({ model }: { model: SetupModelView }) {
  const revisions = useRevisions(model.id);
  const navigate = useNavigate();
  const [picked, setPicked] = useState<string[]>([]);
  const [reverting, setReverting] = useState<RevisionSummary | null>(null);
  const [forking, setForking] = useState<RevisionSummary | null>(null);
  const list = revisionsOf(revisions.data?.pages);
  const pair = comparePair(picked, list);
  const editable = canEdit(model.role);
  // A fork lands in a workspace the reader edits (this one or another); without one it cannot work.
  const { workspaces } = useSession();
  const canFork = workspaces.some((workspace) => canEdit(workspace.role));

  if (revisions.isPending) return <LoadingState label="Loading the history…" />;
  if (revisions.isError && !revisions.data)
    return (
      <ErrorState
        title="The history could not be loaded"
        error={revisions.error}
        onRetry={() => void revisions.refetch()}
      />
    );
  if (list.length === 0)
    return <EmptyState title="No revisions yet">The first save of this model's setup starts its history.</EmptyState>;

  const pickedNumbers = picked
    .map((id) => list.find((revision) => revision.id === id)?.number)
    .filter((n): n is number => n !== undefined);

  return (
    <>
      <div
        className={cx(
          'sticky top-0 z-10 mb-4 flex flex-wrap items-center gap-3 rounded-lg border border-ply-200 bg-paper/95 px-4 py-2.5 backdrop-blur',
          CARD_INSET,
        )}
        aria-live="polite"
      >
        <p className="flex-1 text-sm text-ink-700">
          {picked.length === 0 && 'Tick two revisions to compare them.'}
          {picked.length === 1 && `Revision ${pickedNumbers[0]} picked; tick one more.`}
          {pair && `Revisions ${pair.from.number} and ${pair.to.number} picked.`}
        </p>
        {picked.length > 0 && (
          <Button size="sm" variant="quiet" onClick={() => setPicked([])}>
            Clear
          </Button>
        )}
        <Button
          size="sm"
          disabled={!pair}
          onClick={() => {
            if (pair) void navigate(`/models/${model.id}/compare${compareSearch(pair.from, pair.to)}`);
          }}
        >
          {pair ? `Compare r${pair.from.number} with r${pair.to.number}` : 'Compare'}
        </Button>
      </div>
      <RevisionTimeline
        model={model}
        revisions={list}
        picked={picked}
        onPick={(id) => setPicked((current) => togglePick(current, id))}
        editable={editable}
        onRevert={setReverting}
        onFork={canFork ? setForking : undefined}
      />
      {revisions.hasNextPage && (
        <div className="mt-2 flex justify-center">
          <Button
            variant="secondary"
            pending={revisions.isFetchingNextPage}
            onClick={() => void revisions.fetchNextPage()}
          >
            Show older revisions
          </Button>
        </div>
      )}
      {revisions.isFetchNextPageError && (
        <ErrorState
          title="Older revisions could not be loaded"
          error={revisions.error}
          onRetry={() => void revisions.fetchNextPage()}
        />
      )}
      {reverting && <RevertDialog model={model} revision={reverting} onClose={() => setReverting(null)} />}
      {forking && <ForkDialog model={model} revision={forking} onClose={() => setForking(null)} />}
    </>
  );
}
