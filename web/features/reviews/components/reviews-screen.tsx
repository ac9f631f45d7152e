import { Link } from 'react-router-dom';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { LoadingState } from '../../../components/ui/loading-state';
import { PageHeader } from '../../../components/ui/page-header';
import { nextPageOf, ShowMore } from '../../../components/ui/show-more';
import { itemsOf, totalOf } from '../../../lib/paged';
import { useSession } from '../../auth/hooks/use-session';
import { useCurrentWorkspace } from '../../workspaces/hooks/use-current-workspace';
import { useWorkspaceReviews } from '../api/reviews';
import { ReviewTable } from './review-table';

/** `/w/:wsId/reviews`: the workspace's review requests, open ones first, then the decided ones, each a page at a time. */
export function ReviewsScreen() {
  const { inUrl } = useCurrentWorkspace();
  const { user } = useSession();
  const open = useWorkspaceReviews(inUrl?.id ?? '', 'open');
  const decided = useWorkspaceReviews(inUrl?.id ?? '', 'closed');
  if (!inUrl) return null;

  let body;
  if (open.isPending || decided.isPending) body = <LoadingState label="Loading the reviews…" />;
  // A failed next page keeps the pages already shown; only a first page that failed replaces the lists.
  else if (!open.data || !decided.data)
    body = (
      <ErrorState
        title="The reviews could not be loaded"
        error={open.error ?? decided.error}
        onRetry={() => {
          void open.refetch();
          void decided.refetch();
        }}
      />
    );
  else {
    const openReviews = itemsOf(open.data.pages);
    const pastReviews = itemsOf(decided.data.pages);
    const openTotal = totalOf(open.data.pages);
    const pastTotal = totalOf(decided.data.pages);
    const mine = openReviews.filter((review) => review.reviewers.some((reviewer) => reviewer.id === user.id)).length;
    body =
      openTotal + pastTotal === 0 ? (
        <EmptyState title="No reviews yet" action={<Link to={`/w/${inUrl.id}/hangar`}>Go to the hangar</Link>}>
          Open a model's Reviews tab and ask a club mate to look over the revision that will fly.
        </EmptyState>
      ) : (
        <div className="space-y-8">
          <section aria-labelledby="open-reviews">
            <div className="mb-3 flex flex-wrap items-baseline gap-x-3">
              <h2 id="open-reviews" className="text-lg font-semibold text-ink-900">
                Waiting for a verdict
              </h2>
              <span className="text-sm text-ink-700">
                {openTotal} open{mine > 0 && `, ${mine} asking you`}
              </span>
            </div>
            {openReviews.length === 0 ? (
              <p className="text-base text-ink-700">Nothing is waiting: every review has a verdict.</p>
            ) : (
              <ReviewTable reviews={openReviews} caption="Open reviews" />
            )}
            <ShowMore shown={openReviews.length} total={openTotal} noun="open reviews" {...nextPageOf(open)} />
          </section>
          <section aria-labelledby="past-reviews">
            <div className="mb-3 flex flex-wrap items-baseline gap-x-3">
              <h2 id="past-reviews" className="text-lg font-semibold text-ink-900">
                Decided
              </h2>
              {pastTotal > 0 && <span className="text-sm text-ink-700">{pastTotal} in all</span>}
            </div>
            {pastReviews.length === 0 ? (
              <p className="text-base text-ink-700">No review has been decided yet.</p>
            ) : (
              <ReviewTable reviews={pastReviews} caption="Decided reviews" />
            )}
            <ShowMore shown={pastReviews.length} total={pastTotal} noun="decided reviews" {...nextPageOf(decided)} />
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
