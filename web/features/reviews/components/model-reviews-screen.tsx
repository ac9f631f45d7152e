import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { Badge, ReviewStateBadge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { CheckIcon } from '../../../components/ui/icons';
import { LoadingState } from '../../../components/ui/loading-state';
import { PageHeader } from '../../../components/ui/page-header';
import { useModel } from '../../models/api/get-model';
import { canEdit } from '../../models/permissions';
import type { SetupModelView } from '../../models/types';
import { useModelReviews } from '../api/reviews';
import { nextPageOf, ShowMore } from '../../../components/ui/show-more';
import { itemsOf, totalOf } from '../../../lib/paged';
import { RequestReviewDialog } from './request-review-dialog';
import { ReviewTable } from './review-table';

/**
 * Where the model stands, in a sentence that agrees with the list below it: a model
 * whose earlier revisions were reviewed is not "never reviewed" just because its
 * latest revision has not been.
 */
function stateSentence(model: SetupModelView, reviewed: boolean): string {
  const latest = model.latest ? `revision ${model.latest.number}` : 'the latest revision';
  const approved = model.approved;
  switch (model.review_state) {
    case 'none':
      return reviewed
        ? `The latest revision, ${latest}, has not been reviewed; the reviews below are of earlier revisions.`
        : 'Nobody has reviewed this model yet.';
    case 'pending':
      return `A review of ${latest}, the latest, is waiting for a verdict.`;
    case 'approved':
      return `The latest revision, ${latest}, is approved.`;
    case 'stale':
      return approved
        ? `Revision ${approved.number} is approved, but the setup has changed since: ${latest} needs a review of its own.`
        : `An earlier revision was approved, but the setup has changed since: ${latest} needs a review of its own.`;
    case 'changes-requested':
      return `A reviewer asked for changes to ${latest}, the latest.`;
  }
}

/** `/models/:modelId/reviews`: the model's sign-off state, its reviews, and "Request review". */
export function ModelReviewsScreen() {
  const { modelId = '' } = useParams();
  const model = useModel(modelId);
  const reviews = useModelReviews(modelId);
  const [asking, setAsking] = useState(false);

  if (model.isPending) return <LoadingState label="Loading the model…" />;
  if (model.isError) return null;
  const loaded = itemsOf(reviews.data?.pages);
  const openOnLatest = loaded.find((review) => review.state === 'open' && review.revision.id === model.data.latest?.id);

  return (
    <>
      <PageHeader
        title="Reviews"
        documentTitle={`Reviews · ${model.data.name}`}
        description="A second pilot signs off the revision that will fly. An approval holds while the setup stays as approved."
        actions={
          <RequestAction model={model.data} openReviewId={openOnLatest?.id ?? null} onAsk={() => setAsking(true)} />
        }
      />
      <Card className="mb-6 flex flex-wrap items-center gap-3 px-4 py-3">
        <ReviewStateBadge state={model.data.review_state} />
        {model.data.cleared_for_maiden && (
          <Badge tone="moss" icon={CheckIcon}>
            Cleared for its maiden
          </Badge>
        )}
        <p className="text-base text-ink-700">{stateSentence(model.data, loaded.length > 0)}</p>
        {model.data.approved && model.data.approved.number !== model.data.latest?.number && (
          <p className="w-full text-sm text-ink-700">
            Cleared to fly: revision {model.data.approved.number}, approved by{' '}
            {model.data.approved.approvers.map((person) => person.name).join(', ') || 'a former member'}.{' '}
            <Link to={`/models/${model.data.id}/sheet?revision=${model.data.approved.number}`}>Its field sheet</Link>
            {' · '}
            <Link to={`/models/${model.data.id}/overview?revision=${model.data.approved.number}`}>Its overview</Link>
          </p>
        )}
      </Card>
      {asking && <RequestReviewDialog model={model.data} onClose={() => setAsking(false)} />}
      {reviews.isPending ? (
        <LoadingState label="Loading the reviews…" />
      ) : !reviews.data ? (
        <ErrorState
          title="The reviews could not be loaded"
          error={reviews.error}
          onRetry={() => void reviews.refetch()}
        />
      ) : loaded.length === 0 ? (
        <EmptyState title="No reviews of this model yet">
          {canEdit(model.data.role)
            ? 'Request a review when the setup is ready to fly.'
            : 'Owners and editors ask for reviews; reviewers then give their verdicts here.'}
        </EmptyState>
      ) : (
        <>
          <ReviewTable reviews={loaded} caption={`Reviews of ${model.data.name}`} showModel={false} />
          <ShowMore shown={loaded.length} total={totalOf(reviews.data.pages)} noun="reviews" {...nextPageOf(reviews)} />
        </>
      )}
    </>
  );
}

function RequestAction({
  model,
  openReviewId,
  onAsk,
}: {
  model: SetupModelView;
  openReviewId: string | null;
  onAsk: () => void;
}) {
  if (!canEdit(model.role) || !model.latest) return null;
  if (openReviewId) {
    return (
      <Link to={`/w/${model.workspace_id}/reviews/${openReviewId}`} className="text-sm">
        Revision {model.latest.number} has an open review
      </Link>
    );
  }
  return <Button onClick={onAsk}>Request review</Button>;
}
