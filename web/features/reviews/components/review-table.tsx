import { Link } from 'react-router-dom';
import { Badge } from '../../../components/ui/badge';
import { Card } from '../../../components/ui/card';
import { StaleIcon } from '../../../components/ui/icons';
import { CheckBadges } from '../../models/components/check-badges';
import { TimeAgo } from '../../models/components/time-ago';
import type { ReviewSummary } from '../types';
import { RequestStateBadge } from './review-badges';

/** Review requests in a table: what is reviewed, who asked whom, where it stands. */
export function ReviewTable({
  reviews,
  caption,
  showModel = true,
}: {
  reviews: ReviewSummary[];
  caption: string;
  showModel?: boolean;
}) {
  return (
    <Card className="overflow-x-auto">
      <table className="w-full min-w-[40rem] table-fixed text-left text-base">
        <caption className="sr-only">{caption}</caption>
        <colgroup>
          <col className="w-[38%]" />
          <col className="w-[18%]" />
          <col className="w-[20%]" />
          <col className="w-[24%]" />
        </colgroup>
        <thead className="border-b border-ply-200 text-sm text-ink-700">
          <tr>
            <th scope="col" className="px-4 py-3 font-medium">
              {showModel ? 'Model and revision' : 'Revision'}
            </th>
            <th scope="col" className="px-4 py-3 font-medium">
              Asked by
            </th>
            <th scope="col" className="px-4 py-3 font-medium">
              Reviewers
            </th>
            <th scope="col" className="px-4 py-3 font-medium">
              State
            </th>
          </tr>
        </thead>
        <tbody className="divide-y divide-ply-100">
          {reviews.map((review) => (
            <tr key={review.id} className="align-top">
              <td className="px-4 py-3">
                <Link to={`/w/${review.workspace_id}/reviews/${review.id}`} className="font-medium">
                  {showModel
                    ? `${review.model.name}, revision ${review.revision.number}`
                    : `Revision ${review.revision.number}`}
                </Link>
                <div className="mt-1 flex flex-wrap items-center gap-1.5">
                  <CheckBadges errors={review.revision.error_count} warnings={review.revision.warning_count} />
                  {review.latest && !review.latest.same_content && (
                    <Badge tone="caution" icon={StaleIcon}>
                      Revision {review.latest.number} is newer
                    </Badge>
                  )}
                </div>
                {review.note && <p className="mt-1 max-w-prose text-sm text-ink-700">{review.note}</p>}
              </td>
              <td className="px-4 py-3 text-sm text-ink-700">
                <span className="block text-base text-ink-900">{review.requested_by?.name ?? 'Former member'}</span>
                <TimeAgo iso={review.created_at} />
              </td>
              <td className="px-4 py-3 text-sm text-ink-900">
                {review.reviewers.map((reviewer) => reviewer.name).join(', ')}
              </td>
              <td className="px-4 py-3">
                <RequestStateBadge state={review.state} />
                {review.decided_at && (
                  <span className="mt-1 block text-sm text-ink-700">
                    <TimeAgo iso={review.decided_at} />
                  </span>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </Card>
  );
}
