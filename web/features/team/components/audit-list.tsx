import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { ErrorState } from '../../../components/ui/error-state';
import { LoadingState } from '../../../components/ui/loading-state';
import type { Id } from '../../../types/api';
import { TimeAgo } from '../../models/components/time-ago';
import { auditEventsOf, useAudit } from '../api/get-audit';
import { auditLine } from '../audit-sentence';

/** The workspace's audit trail, newest first, twenty events at a time: shown to owners. */
export function AuditList({ workspaceId }: { workspaceId: Id }) {
  const audit = useAudit(workspaceId);
  const events = auditEventsOf(audit.data?.pages);
  const total = audit.data?.pages.at(-1)?.total ?? events.length;

  return (
    <Card className="p-5">
      <h2 className="text-lg font-semibold text-ink-900">Activity</h2>
      <p className="mt-0.5 text-sm text-ink-700">
        Who saved, reverted, forked, invited, changed a role, asked for a review or gave a verdict, and when.
      </p>
      {audit.isPending ? (
        <LoadingState label="Loading the activity…" />
      ) : audit.isError && events.length === 0 ? (
        <div className="mt-3">
          <ErrorState
            title="The activity could not be loaded"
            error={audit.error}
            onRetry={() => void audit.refetch()}
          />
        </div>
      ) : events.length === 0 ? (
        <p className="mt-3 text-sm text-ink-700">Nothing has happened in this workspace yet.</p>
      ) : (
        <>
          <ol className="mt-3 divide-y divide-ply-100" aria-label="Activity in this workspace">
            {events.map((event) => {
              const line = auditLine(event, workspaceId);
              return (
                <li key={event.id} className="flex flex-wrap items-baseline gap-x-2 gap-y-0.5 py-2.5 text-base">
                  <span className="min-w-0 flex-1">
                    {line.model && <span className="text-ink-700">{line.model}: </span>}
                    <span className="font-medium text-ink-900">{event.actor?.name ?? 'Someone'}</span>{' '}
                    <span className="text-ink-700">{line.text}</span>
                    {line.link && (
                      <>
                        {' · '}
                        <Link to={line.link.to} className="text-sm">
                          {line.link.label}
                        </Link>
                      </>
                    )}
                  </span>
                  <TimeAgo iso={event.created_at} className="text-sm whitespace-nowrap text-ink-500" />
                </li>
              );
            })}
          </ol>
          {audit.isFetchNextPageError && (
            <ErrorState
              title="Older activity could not be loaded"
              error={audit.error}
              onRetry={() => void audit.fetchNextPage()}
            />
          )}
          {audit.hasNextPage && (
            <div className="mt-3 flex flex-wrap items-center gap-3">
              <Button
                variant="secondary"
                size="sm"
                pending={audit.isFetchingNextPage}
                onClick={() => void audit.fetchNextPage()}
              >
                Show older activity
              </Button>
              <span className="text-sm text-ink-700">
                The newest {events.length} of {total} events.
              </span>
            </div>
          )}
        </>
      )}
    </Card>
  );
}
