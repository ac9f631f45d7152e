import { Link } from 'react-router-dom';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { LoadingState } from '../../../components/ui/loading-state';
import { PageHeader } from '../../../components/ui/page-header';
import { useSession } from '../../auth/hooks/use-session';
import { useCurrentWorkspace } from '../../workspaces/hooks/use-current-workspace';
import { useWorkspaceReviews } from '../api/reviews';
import { ReviewTable } from './review-table';

/** `/w/:wsId/reviews`: the workspace's review requests, open ones first, then the decided ones. */
export function ReviewsScreen() {
  const { inUrl } = useCurrentWorkspace();
  const { user } = useSession();
  const reviews = useWorkspaceReviews(inUrl?.id ?? '');
  if (!inUrl) return null;

  let body;
  if (reviews.isPending) body = <LoadingState label="Loading the reviews…" />;
  else if (reviews.isError)
    body = (
      <ErrorState
        title="The reviews could not be loaded"
        error={reviews.error}
        onRetry={() => void reviews.refetch()}
      />
    );
  else if (reviews.data.length === 0) {
    body = (
      <EmptyState title="No reviews yet" action={<Link to={`/w/${inUrl.id}/hangar`}>Go to the hangar</Link>}>
        Open a model's Reviews tab and ask a club mate to look over the revision that will fly.
      </EmptyState>
    );
  } else {
    const open = reviews.data.filter((review) => review.state === 'open');
    const past = reviews.data.filter((review) => review.state !== 'open');
    const mine = open.filter((review) => review.reviewers.some((reviewer) => reviewer.id === user.id)).length;
    body = (
      <div className="space-y-8">
        <section aria-labelledby="open-reviews">
          <div className="mb-3 flex flex-wrap items-baseline gap-x-3">
            <h2 id="open-reviews" className="text-lg font-semibold text-ink-900">
              Waiting for a verdict
            </h2>
            <span className="text-sm text-ink-700">
              {open.length} open{mine > 0 && `, ${mine} asking you`}
            </span>
          </div>
          {open.length === 0 ? (
            <p className="text-base text-ink-700">Nothing is waiting: every review has a verdict.</p>
          ) : (
            <ReviewTable reviews={open} caption="Open reviews" />
          )}
        </section>
        <section aria-labelledby="past-reviews">
          <h2 id="past-reviews" className="mb-3 text-lg font-semibold text-ink-900">
            Decided
          </h2>
          {past.length === 0 ? (
            <p className="text-base text-ink-700">No review has been decided yet.</p>
          ) : (
            <ReviewTable reviews={past} caption="Decided reviews" />
          )}
        </section>
      </div>
    );
  }

  return (
    <>
      <PageHeader
        title="Reviews"
        documentTitle={`Reviews · ${inUrl.name}`}
        description="Sign-off before a maiden: a second pilot compares the revision that will fly with the last approved one and works through the pre-maiden checklist."
      />
      {body}
    </>
  );
}
