import { Link, useParams } from 'react-router-dom';
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
import { useReview } from '../api/reviews';
import type { ReviewDetail } from '../types';
import { CommentsPanel } from './comments-panel';
import { ChecklistPanel } from './checklist-panel';
import { RequestStateBadge, VerdictBadge } from './review-badges';
import { VerdictForm } from './verdict-form';

const BASE_WORDS = {
  approved: 'the last approved revision',
  parent: 'the revision before it',
  'fork-source': 'the revision it was forked from',
} as const;

/** `/w/:wsId/reviews/:reviewId`: one review, everything the reviewer needs on one page. */
export function ReviewScreen() {
  const { reviewId = '' } = useParams();
  const review = useReview(reviewId);

  if (review.isPending) return <LoadingState label="Loading the review…" />;
  if (review.isError)
    return (
      <ErrorState title="This review could not be loaded" error={review.error} onRetry={() => void review.refetch()} />
    );
  return <ReviewPage review={review.data} />;
}

function ReviewPage({ review }: { review: ReviewDetail }) {
  const title = `${review.model.name}, revision ${review.revision.number}`;
  const modelPath = `/models/${review.model.id}`;

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

      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="min-w-0 space-y-6">
          <StatusCard review={review} />
          <section aria-labelledby="compare-heading">
            <div className="mb-3 flex flex-wrap items-baseline gap-x-3 gap-y-1">
              <h2 id="compare-heading" className="text-lg font-semibold text-ink-900">
                {review.base ? `What changed since revision ${review.base.revision.number}` : 'The whole setup'}
              </h2>
              {review.base && review.compare && <KindCounts counts={review.compare.counts} />}
            </div>
            {review.base && review.compare ? (
              <>
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
              </>
            ) : (
              <Card className="px-4 py-3 text-base text-ink-700">
                This is the model’s first revision and nothing was approved before it: review the whole setup on the{' '}
                <Link to={`${modelPath}/overview`}>model’s overview</Link>.
              </Card>
            )}
          </section>

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

          <CommentsPanel review={review} />
        </div>

        <aside className="space-y-6" aria-label="Sign-off">
          {review.can.verdict ? (
            <VerdictForm review={review} />
          ) : (
            <Card className="p-5 text-sm text-ink-700">
              Reviewers, editors and owners give verdicts; your role here lets you read the review.
            </Card>
          )}
          <ChecklistPanel review={review} />
          <Verdicts review={review} />
        </aside>
      </div>
      <CautionsPanel className="mt-8" />
    </>
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
            </li>
          ))}
        </ol>
      )}
    </Card>
  );
}
