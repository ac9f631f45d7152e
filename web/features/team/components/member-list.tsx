import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { LoadingState } from '../../../components/ui/loading-state';
import type { Id } from '../../../types/api';
import { useSession } from '../../auth/hooks/use-session';
import { useMembers } from '../api/get-members';
import { RoleBadge } from './role-badge';

export function MemberList({ workspaceId }: { workspaceId: Id }) {
  const members = useMembers(workspaceId);
  const { user } = useSession();

  if (members.isPending) return <LoadingState label="Loading members…" />;
  if (members.isError) return <ErrorState title="The member list could not be loaded" error={members.error} onRetry={() => void members.refetch()} />;
  if (members.data.length === 0) {
    return <EmptyState title="No members yet">Invite club mates to share this workspace's models and receivers.</EmptyState>;
  }

  return (
    <>
    <Card className="overflow-x-auto">
      <table className="w-full text-left text-base">
        <caption className="sr-only">Members of this workspace</caption>
        <thead className="border-b border-ply-200 text-sm text-ink-700">
          <tr>
            <th scope="col" className="px-4 py-3 font-medium">Name</th>
            <th scope="col" className="px-4 py-3 font-medium">E-mail</th>
            <th scope="col" className="px-4 py-3 font-medium">Role</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-ply-100">
          {members.data.map((member) => (
            <tr key={member.user.id}>
              <td className="px-4 py-3 font-medium text-ink-900">
                {member.user.name}
                {member.user.id === user.id && <span className="ml-2 text-sm font-normal text-ink-700">(you)</span>}
              </td>
              <td className="px-4 py-3 font-mono text-sm break-all text-ink-700">{member.user.email}</td>
              <td className="px-4 py-3">
                <RoleBadge role={member.role} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </Card>
    <p className="mt-4 max-w-prose text-sm text-ink-700">
      Owners manage members and roles; editors change models, revisions and receivers; reviewers read everything and give
      verdicts; viewers read.
    </p>
    </>
  );
}
