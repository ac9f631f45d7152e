import { useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { Badge, ReviewStateBadge } from '../../../components/ui/badge';
import { Card } from '../../../components/ui/card';
import { ErrorState } from '../../../components/ui/error-state';
import { CheckIcon, StaleIcon } from '../../../components/ui/icons';
import { LoadingState } from '../../../components/ui/loading-state';
import { PageHeader } from '../../../components/ui/page-header';
import { CautionsPanel } from '../../cautions/components/cautions-panel';
import { ChangeList, KindCounts } from '../../compare/components/change-list';
import { FindingsDeltaView } from '../../compare/components/findings-delta';
import { OutputsDeltaTable } from '../../compare/components/outputs-delta-table';
import { TextDiffView } from '../../compare/components/text-diff-view';
import { ChangeFindingsPanel } from '../../findings/components/change-findings-panel';
import { FindingsList } from '../../findings/components/findings-list';
import { CheckBadges } from '../../models/components/check-badges';
import { TimeAgo } from '../../models/components/time-ago';
import { SelectField } from '../../../components/ui/select-field';
import { revisionsOf, useRevisions } from '../../models/api/list-revisions';
import { useReview } from '../api/reviews';
import type { BaseParam, LeftOpen, ReviewDetail } from '../types';
import { ChecklistPanel } from './checklist-panel';
import { ReviewPlanView, type ChosenSetting } from './review-plan';
import { ThreadsPanel } from './threads-panel';
import { RequestStateBadge, VerdictBadge } from './review-badges';
import { VerdictForm } from './verdict-form';

const BASE_WORDS = {
  approved: 'the last approved revision',
  previous: 'the revision before it',
  chosen: 'the revision you chose',
} as const;

const BASE_PARAMS = new Set(['approved', 'previous', 'none']);

/** `?base=` as the page understands it: approved, previous, none or a revision number; anything else is the default. */
function baseParamOf(value: string | null): BaseParam {
  if (value === null) return null;
  if (BASE_PARAMS.has(value) || /^\d{1,9}$/.test(value)) return value as BaseParam;
  return null;
}

/** `/w/:wsId/reviews/:reviewId`: one review, everything the reviewer needs on one page. */
export function ReviewScreen() {
  const { reviewId = '' } = useParams();
  const [params, setParams] = useSearchParams();
  const base = baseParamOf(params.get('base'));
  const review = useReview(reviewId, base);

  if (review.isPending) return <LoadingState label="Loading the review…" />;
  if (review.isError)
    return (
      <ErrorState
        title={base ? 'This review could not be compared with that revision' : 'This review could not be loaded'}
        error={review.error}
        onRetry={base ? () => setParams({}, { replace: true }) : () => void review.refetch()}
        retryLabel={base ? 'Compare with the default' : undefined}
      />
    );
  return (
    <ReviewPage
      review={review.data}
      base={base}
      comparing={review.isFetching && review.isPlaceholderData}
      onBaseChange={(next) => setParams(next ? { base: next } : {}, { replace: true })}
    />
  );
}

function ReviewPage({
  review,
  base,
  comparing,
  onBaseChange,
}: {
  review: ReviewDetail;
  base: BaseParam;
  comparing: boolean;
  onBaseChange: (base: BaseParam) => void;
}) {
  const title = `${review.model.name}, revision ${review.revision.number}`;
  const modelPath = `/models/${review.model.id}`;
  const [chosen, setChosen] = useState<ChosenSetting | null>(null);

  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm text-ink-700">
        <Link to={`/w/${review.workspace_id}/reviews`}>Reviews</Link>
        <span aria-hidden="true" className="px-1.5 text-ink-500">
          /
        </span>
        <span>{title}</span>
      </nav>
      <PageHeader
        title={`Review of ${title}`}
        documentTitle={`Review · ${title}`}
        description={
          <>
            {review.requested_by?.name ?? 'A former member'} asked{' '}
            {review.reviewers.map((reviewer) => reviewer.name).join(', ')} to review it{' '}
            <TimeAgo iso={review.created_at} inSentence />.
          </>
        }
        actions={
          <div className="flex flex-wrap items-center gap-2">
            <RequestStateBadge state={review.state} />
            <Link to={`${modelPath}/reviews`} className="text-sm">
              The model’s reviews
            </Link>
          </div>
        }
      />

      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_24rem]">
        <div className="min-w-0 space-y-6">
          <StatusCard review={review} />
          <section aria-labelledby="plan-heading" aria-busy={comparing || undefined}>
            <div className="mb-3 flex flex-wrap items-end justify-between gap-3">
              <div>
                <h2 id="plan-heading" className="text-lg font-semibold text-ink-900">
                  The whole setup of revision {review.revision.number}
                </h2>
                <p className="text-sm text-ink-700">
                  {review.base
                    ? `Each entry is marked against ${BASE_WORDS[review.base.kind]}, revision ${review.base.revision.number}.`
                    : 'Nothing to compare with: every entry is new to the reviewer.'}
                </p>
              </div>
              <BasePicker review={review} base={base} onChange={onBaseChange} />
            </div>
            <ReviewPlanView
              modelId={review.model.id}
              plan={review.plan}
              openPaths={review.threads.open_paths}
              canComment={review.can.comment}
              onChoose={setChosen}
            />
          </section>

          {review.base && review.compare && (
            <section aria-labelledby="compare-heading">
              <div className="mb-3 flex flex-wrap items-baseline gap-x-3 gap-y-1">
                <h2 id="compare-heading" className="text-lg font-semibold text-ink-900">
                  What changed since revision {review.base.revision.number}
                </h2>
                <KindCounts counts={review.compare.counts} />
              </div>
              <p className="mb-3 text-sm text-ink-700">
                Compared with {BASE_WORDS[review.base.kind]}, revision {review.base.revision.number}
                {review.base.revision.author && ` by ${review.base.revision.author.name}`}: “
                {review.base.revision.message}”.
              </p>
              <ChangeList changes={review.compare.changes} sections={review.compare.sections} />
              <details
                className="mt-4 rounded-lg border border-ply-200 bg-paper-raised px-4 py-3"
                open={review.compare.findings_delta.introduced.length > 0}
              >
                <summary className="cursor-pointer font-medium text-ink-900">
                  What the checks say differently ({review.compare.findings_delta.introduced.length} new,{' '}
                  {review.compare.findings_delta.resolved.length} resolved)
                </summary>
                <div className="mt-3">
                  <FindingsDeltaView
                    delta={review.compare.findings_delta}
                    toModelId={review.model.id}
                    toIsLatest={review.latest?.id === review.revision.id}
                  />
                </div>
              </details>
              <ChangeFindingsPanel
                findings={review.compare.change_findings}
                level={3}
                className="mt-3 rounded-lg border border-ply-200 bg-paper-raised px-4 py-3"
              />
              <details className="mt-3 rounded-lg border border-ply-200 bg-paper-raised px-4 py-3">
                <summary className="cursor-pointer font-medium text-ink-900">Which pins now move differently</summary>
                <div className="mt-3">
                  <OutputsDeltaTable deltas={review.compare.outputs_delta} />
                </div>
              </details>
              <details className="mt-3 rounded-lg border border-ply-200 bg-paper-raised px-4 py-3">
                <summary className="cursor-pointer font-medium text-ink-900">The YAML side by side</summary>
                <div className="mt-3">
                  <TextDiffView
                    diff={review.compare.text}
                    fromLabel={`Revision ${review.base.revision.number}`}
                    toLabel={`Revision ${review.revision.number}`}
                  />
                </div>
              </details>
            </section>
          )}

          <section aria-labelledby="findings-heading">
            <div className="mb-3 flex flex-wrap items-baseline gap-x-3">
              <h2 id="findings-heading" className="text-lg font-semibold text-ink-900">
                Findings of revision {review.revision.number}
              </h2>
              <CheckBadges errors={review.revision.error_count} warnings={review.revision.warning_count} />
            </div>
            <FindingsList
              findings={review.findings}
              modelId={review.latest?.id === review.revision.id ? review.model.id : undefined}
              emptyText="The checks found nothing in this revision."
            />
          </section>

          <ThreadsPanel
            where={{ reviewId: review.id, revisionId: review.revision.id, workspaceId: review.workspace_id }}
            canComment={review.can.comment}
            chosen={chosen}
            onChosenChange={setChosen}
          />
        </div>

        <aside className="space-y-6" aria-label="Sign-off">
          {/* The checklist comes before the verdict, on screen and in tab order. */}
          <ChecklistPanel review={review} base={base} />
          {review.can.verdict ? (
            <VerdictForm review={review} />
          ) : (
            <Card className="p-5 text-sm text-ink-700">
              Reviewers, editors and owners give verdicts; your role here lets you read the review.
            </Card>
          )}
          <Verdicts review={review} />
        </aside>
      </div>
      <CautionsPanel className="mt-8" />
    </>
  );
}

/** Which revision the page compares with: the last approved, the previous, none, or any other of the model's. */
function BasePicker({
  review,
  base,
  onChange,
}: {
  review: ReviewDetail;
  base: BaseParam;
  onChange: (base: BaseParam) => void;
}) {
  const history = useRevisions(review.model.id);
  const others = revisionsOf(history.data?.pages).filter((revision) => revision.id !== review.revision.id);
  const value = base ?? (review.base?.kind === 'approved' ? 'approved' : 'none');
  const { approved, previous } = review.base_options;
  return (
    <SelectField
      label="Compare with"
      value={value}
      onChange={(event) => onChange(event.target.value as BaseParam)}
      className="w-full sm:w-80"
    >
      {approved && <option value="approved">The last approved revision ({approved.number})</option>}
      {previous && <option value="previous">The revision before it ({previous.number})</option>}
      <option value="none">Nothing: show the whole setup as new</option>
      {others.length > 0 && (
        <optgroup label="Another revision">
          {others.map((revision) => (
            <option key={revision.id} value={String(revision.number)}>
              Revision {revision.number}
              {revision.message ? ` · ${revision.message}` : ''}
            </option>
          ))}
        </optgroup>
      )}
    </SelectField>
  );
}

function StatusCard({ review }: { review: ReviewDetail }) {
  const { model_state: state, latest } = review;
  const newer = latest && latest.id !== review.revision.id;
  return (
    <Card className="space-y-2 px-4 py-3">
      <div className="flex flex-wrap items-center gap-2">
        <span className="text-sm text-ink-700">The model now:</span>
        <ReviewStateBadge state={state.review_state} />
        {state.cleared_for_maiden && (
          <Badge tone="moss" icon={CheckIcon}>
            Cleared for its maiden
          </Badge>
        )}
      </div>
      {newer && (
        <p className="flex items-start gap-2 text-sm text-ink-900">
          <StaleIcon className="mt-1 shrink-0 text-caution-700" />
          {latest.same_content
            ? `Revision ${latest.number} is the latest; it differs only in comments or formatting, so a verdict here still applies to it.`
            : `Revision ${latest.number} is the latest and its setup differs from this one: an approval here does not clear it.`}
        </p>
      )}
      {review.note && (
        <p className="text-base text-ink-900">
          <span className="font-medium">Note from {review.requested_by?.name ?? 'the requester'}:</span> {review.note}
        </p>
      )}
      <p className="font-mono text-xs break-all text-ink-500">Content hash {review.revision.content_hash}</p>
    </Card>
  );
}

function Verdicts({ review }: { review: ReviewDetail }) {
  return (
    <Card className="p-5">
      <h2 className="text-lg font-semibold text-ink-900">Verdicts</h2>
      {review.verdicts.length === 0 ? (
        <p className="mt-2 text-sm text-ink-700">No verdict yet.</p>
      ) : (
        <ol className="mt-3 space-y-3" aria-label="Verdicts given">
          {[...review.verdicts].reverse().map((verdict) => (
            <li key={verdict.id} className="border-l-2 border-ply-300 pl-3">
              <div className="flex flex-wrap items-center gap-x-2 gap-y-1 text-sm">
                <span className="font-medium text-ink-900">{verdict.reviewer?.name ?? 'Former member'}</span>
                <VerdictBadge verdict={verdict.verdict} />
                <TimeAgo iso={verdict.created_at} className="text-ink-500" />
              </div>
              {verdict.body && <p className="mt-1 text-base whitespace-pre-wrap text-ink-900">{verdict.body}</p>}
              {verdict.left_open && <LeftOpenNote left={verdict.left_open} />}
            </li>
          ))}
        </ol>
      )}
    </Card>
  );
}

/** What an approval was confirmed with, left undone: on the review for everyone to read. */
function LeftOpenNote({ left }: { left: LeftOpen }) {
  return (
    <div className="mt-2 rounded-md border border-caution-700/40 bg-caution-100 px-3 py-2 text-sm text-ink-900">
      <p className="font-medium">Approved with these left open:</p>
      <ul className="mt-1 list-disc pl-5">
        {left.unticked.map((item) => (
          <li key={item.id}>Not ticked: {item.label}</li>
        ))}
        {left.warnings.map((warning) => (
          <li key={`${warning.rule}:${warning.path}`}>Open warning: {warning.message}</li>
        ))}
      </ul>
    </div>
  );
}
