import { useState, type ReactNode } from 'react';
import { useParams, useSearchParams } from 'react-router-dom';
import { Button, buttonClasses } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { LoadingState } from '../../../components/ui/loading-state';
import { PageHeader } from '../../../components/ui/page-header';
import { useModel } from '../../models/api/get-model';
import { revisionsOf, useRevisions } from '../../models/api/list-revisions';
import { TimeAgo } from '../../models/components/time-ago';
import type { SetupModelView } from '../../models/types';
import { patchDownloadUrl, useComparison, useTextDiff } from '../api/get-comparison';
import type { CompareResult, CompareSideSummary } from '../types';
import { ChangeFindingsPanel } from '../../findings/components/change-findings-panel';
import { ChangeList, KindCounts } from './change-list';
import { ChangedCurvesView } from './changed-curves-view';
import { FindingsDeltaView } from './findings-delta';
import { OutputsDeltaTable } from './outputs-delta-table';
import { RevisionPicker, type RevisionGroup } from './revision-picker';
import { TextDiffView } from './text-diff-view';

export function CompareScreen() {
  const { modelId = '' } = useParams();
  const model = useModel(modelId);

  let body: ReactNode;
  if (model.isPending) body = <LoadingState label="Loading the revisions…" />;
  else if (model.isError)
    body = (
      <ErrorState title="This model could not be loaded" error={model.error} onRetry={() => void model.refetch()} />
    );
  else body = <Compare model={model.data} />;

  return (
    <>
      <PageHeader
        title="Compare"
        documentTitle={model.data ? `Compare · ${model.data.name}` : 'Compare'}
        description="Two revisions side by side: what changed, section by section, what the checks now say, and which pins now move differently."
      />
      {body}
    </>
  );
}

function sideLabel(side: CompareSideSummary, model: SetupModelView): string {
  return side.model.id === model.id ? `r${side.number}` : `${side.model.name} r${side.number}`;
}

function Compare({ model }: { model: SetupModelView }) {
  const [params, setParams] = useSearchParams();
  const own = useRevisions(model.id);
  const source = model.forked_from?.readable ? model.forked_from : null;
  const sourceRevisions = useRevisions(source?.model_id ?? '');
  const ownList = revisionsOf(own.data?.pages);

  // Without a choice in the address: the latest against the one before it, or, for a
  // fork with one revision, against the revision it was forked from.
  const to = params.get('to') ?? ownList[0]?.id ?? '';
  const from = params.get('from') ?? ownList[1]?.id ?? source?.revision_id ?? '';
  const comparison = useComparison(from || null, to || null);

  const choose = (next: { from?: string; to?: string }) =>
    setParams((current) => {
      const result = new URLSearchParams(current);
      result.set('from', next.from ?? from);
      result.set('to', next.to ?? to);
      return result;
    });

  if (own.isPending) return <LoadingState label="Loading the revisions…" />;
  if (own.isError && !own.data)
    return (
      <ErrorState title="The revisions could not be loaded" error={own.error} onRetry={() => void own.refetch()} />
    );

  const groups: RevisionGroup[] = [{ label: `${model.name} (this model)`, revisions: ownList }];
  if (source)
    groups.push({ label: `${source.model_name} (forked from)`, revisions: revisionsOf(sourceRevisions.data?.pages) });

  const data = comparison.data;
  const current = (id: string, side?: CompareSideSummary) =>
    side && side.id === id ? { id, text: sideLabel(side, model) } : null;

  return (
    <div className="space-y-8">
      <Card className="px-4 py-4">
        <div className="grid items-end gap-3 sm:grid-cols-[1fr_auto_1fr]">
          <RevisionPicker
            label="Older (from)"
            value={from}
            groups={groups}
            current={current(from, data?.from)}
            onChange={(id) => choose({ from: id })}
          />
          <Button
            variant="secondary"
            onClick={() => choose({ from: to, to: from })}
            disabled={!from || !to}
            className="sm:mb-0"
          >
            Swap
          </Button>
          <RevisionPicker
            label="Newer (to)"
            value={to}
            groups={groups}
            current={current(to, data?.to)}
            onChange={(id) => choose({ to: id })}
          />
        </div>
        {own.hasNextPage && (
          <Button
            size="sm"
            variant="quiet"
            className="mt-2"
            pending={own.isFetchingNextPage}
            onClick={() => void own.fetchNextPage()}
          >
            Offer older revisions too
          </Button>
        )}
      </Card>

      {!from || !to ? (
        <EmptyState title="Only one revision so far">
          Save a second revision, or fork from another model, and the two can be compared here.
        </EmptyState>
      ) : comparison.isPending ? (
        <LoadingState label="Comparing…" />
      ) : comparison.isError ? (
        <ErrorState
          title="These two revisions could not be compared"
          error={comparison.error}
          onRetry={() => void comparison.refetch()}
        />
      ) : (
        <Result model={model} result={comparison.data} stale={comparison.isPlaceholderData} />
      )}
    </div>
  );
}

// The text diff of two large setups is most of a compare's weight and few readers
// open it, so it is fetched when they do.
function LazyTextDiff({
  from,
  to,
  fromLabel,
  toLabel,
}: {
  from: string;
  to: string;
  fromLabel: string;
  toLabel: string;
}) {
  const [open, setOpen] = useState(false);
  const diff = useTextDiff(from, to, open);
  return (
    <details
      className="rounded-lg border border-ply-200 bg-paper-raised px-4 py-3"
      onToggle={(event) => setOpen(event.currentTarget.open)}
    >
      <summary className="cursor-pointer font-medium text-ink-900">Show the line-by-line difference</summary>
      <div className="mt-3">
        {diff.isPending ? (
          <LoadingState label="Loading the text difference…" />
        ) : diff.isError ? (
          <ErrorState
            title="The text difference could not be loaded"
            error={diff.error}
            onRetry={() => void diff.refetch()}
          />
        ) : (
          <TextDiffView diff={diff.data} fromLabel={fromLabel} toLabel={toLabel} />
        )}
      </div>
    </details>
  );
}

function Section({
  id,
  title,
  aside,
  children,
}: {
  id: string;
  title: string;
  aside?: ReactNode;
  children: ReactNode;
}) {
  return (
    <section aria-labelledby={id}>
      <div className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
        <h2 id={id} className="text-xl font-semibold text-ink-900">
          {title}
        </h2>
        {aside}
      </div>
      {children}
    </section>
  );
}

function SideCard({ title, side, model }: { title: string; side: CompareSideSummary; model: SetupModelView }) {
  return (
    <div className="min-w-0">
      <p className="text-sm text-ink-700">{title}</p>
      <p className="mt-0.5 font-medium text-ink-900">
        <span className="font-mono">{sideLabel(side, model)}</span>
        {side.message && <span className="font-normal"> · {side.message}</span>}
      </p>
      <p className="text-sm text-ink-700">
        <TimeAgo iso={side.created_at} />
        {side.author && ` by ${side.author.name}`}
      </p>
    </div>
  );
}

function Result({ model, result, stale }: { model: SetupModelView; result: CompareResult; stale: boolean }) {
  const fromLabel = sideLabel(result.from, model);
  const toLabel = sideLabel(result.to, model);
  const toIsLatest = result.to.model.id === model.id && result.to.id === model.latest?.id;
  return (
    <div className={stale ? 'space-y-8 opacity-60' : 'space-y-8'} aria-busy={stale || undefined}>
      <Card className="grid items-start gap-x-6 gap-y-3 px-5 py-4 sm:grid-cols-[minmax(0,1fr)_auto_minmax(0,1fr)] lg:grid-cols-[minmax(0,1fr)_auto_minmax(0,1fr)_auto]">
        <SideCard title="From" side={result.from} model={model} />
        <span aria-hidden="true" className="hidden self-center text-xl text-ink-500 sm:block">
          -&gt;
        </span>
        <SideCard title="To" side={result.to} model={model} />
        <div className="flex flex-wrap items-center gap-2 sm:col-span-3 lg:col-span-1 lg:flex-col lg:items-end">
          <KindCounts counts={result.counts} />
          <a
            href={patchDownloadUrl(result.from.id, result.to.id)}
            download
            className={buttonClasses('secondary', 'sm')}
          >
            Download the changes as a patch file (JSON)
          </a>
        </div>
        {result.from.id === result.to.id && (
          <p className="text-sm text-ink-700 sm:col-span-3 lg:col-span-4">
            Both sides are the same revision; choose another to see differences.
          </p>
        )}
      </Card>

      <Section id="changes-heading" title="Changes by section">
        <ChangeList changes={result.changes} sections={result.sections} />
      </Section>

      <Section id="findings-delta-heading" title="What the checks now say">
        <FindingsDeltaView delta={result.findings_delta} toModelId={model.id} toIsLatest={toIsLatest} />
      </Section>

      <ChangeFindingsPanel findings={result.change_findings} />

      <Section
        id="outputs-delta-heading"
        title="What now moves differently"
        aside={
          <p className="text-sm text-ink-700">
            Along each stick and knob, in each position of the switches the changed mixes use, and with each receiver
            lost in turn.
          </p>
        }
      >
        <OutputsDeltaTable deltas={result.outputs_delta} />
        <ChangedCurvesView fromId={result.from.id} toId={result.to.id} />
      </Section>

      <Section id="text-heading" title="The YAML text">
        <LazyTextDiff from={result.from.id} to={result.to.id} fromLabel={fromLabel} toLabel={toLabel} />
      </Section>
    </div>
  );
}
