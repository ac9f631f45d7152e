import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { ErrorState } from '../../../components/ui/error-state';
import { LoadingState } from '../../../components/ui/loading-state';
import { nextPageOf, ShowMore } from '../../../components/ui/show-more';
import { useToast } from '../../../components/ui/toast';
import { itemsOf, totalOf } from '../../../lib/paged';
import type { Id } from '../../../types/api';
import { TimeAgo } from '../../models/components/time-ago';
import { useInvitations, useRevokeInvitation } from '../api/invitations';
import { RoleBadge } from './role-badge';

export function PendingInvitations({ workspaceId }: { workspaceId: Id }) {
  const invitations = useInvitations(workspaceId, true);
  const revoke = useRevokeInvitation(workspaceId);
  const toast = useToast();
  const shown = itemsOf(invitations.data?.pages);
  const total = totalOf(invitations.data?.pages);

  return (
    <Card className="p-5">
      <div className="flex flex-wrap items-baseline gap-x-3">
        <h2 className="text-lg font-semibold text-ink-900">Pending invitations</h2>
        {total > 0 && <span className="text-sm text-ink-700">{total} waiting</span>}
      </div>
      {invitations.isPending ? (
        <LoadingState label="Loading invitations…" />
      ) : !invitations.data ? (
        <div className="mt-3">
          <ErrorState
            title="The invitations could not be loaded"
            error={invitations.error}
            onRetry={() => void invitations.refetch()}
          />
        </div>
      ) : shown.length === 0 ? (
        <p className="mt-2 text-sm text-ink-700">No invitation is waiting for an answer.</p>
      ) : (
        <>
          <ul className="mt-3 divide-y divide-ply-100" aria-label="Pending invitations">
            {shown.map((invitation) => (
              <li key={invitation.id} className="flex flex-wrap items-center gap-x-3 gap-y-1 py-3">
                <span className="min-w-0 font-mono text-sm break-all text-ink-900">{invitation.email}</span>
                <RoleBadge role={invitation.role} />
                <span className="text-sm text-ink-700">
                  sent <TimeAgo iso={invitation.created_at} />
                  {invitation.invited_by && ` by ${invitation.invited_by.name}`}, expires{' '}
                  <TimeAgo iso={invitation.expires_at} />
                </span>
                <Button
                  variant="quiet"
                  size="sm"
                  className="ml-auto"
                  aria-label={`Withdraw the invitation to ${invitation.email}`}
                  disabled={revoke.isPending}
                  onClick={() =>
                    revoke.mutate(invitation.id, {
                      onSuccess: () =>
                        toast({ title: `The invitation to ${invitation.email} was withdrawn`, tone: 'info' }),
                      onError: (error) =>
                        toast({
                          title: 'Could not withdraw the invitation',
                          description: error.message,
                          tone: 'error',
                        }),
                    })
                  }
                >
                  Withdraw
                </Button>
              </li>
            ))}
          </ul>
          <ShowMore shown={shown.length} total={total} noun="invitations" {...nextPageOf(invitations)} />
        </>
      )}
    </Card>
  );
}
