import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { Dialog } from '../../../components/ui/dialog';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { LoadingState } from '../../../components/ui/loading-state';
import { SelectField } from '../../../components/ui/select-field';
import { useToast } from '../../../components/ui/toast';
import type { Member, Role, WorkspaceMembership } from '../../../types/api';
import { useSession } from '../../auth/hooks/use-session';
import { useMembers } from '../api/get-members';
import { useChangeRole, useRemoveMember } from '../api/manage-members';
import { ROLE_CHOICES, roleWord } from '../roles';
import { RoleBadge } from './role-badge';

export function MemberList({ workspace }: { workspace: WorkspaceMembership }) {
  const members = useMembers(workspace.id);
  const { user } = useSession();
  const [removing, setRemoving] = useState<Member | null>(null);
  const owner = workspace.role === 'owner';

  if (members.isPending) return <LoadingState label="Loading members…" />;
  if (members.isError)
    return (
      <ErrorState
        title="The member list could not be loaded"
        error={members.error}
        onRetry={() => void members.refetch()}
      />
    );
  if (members.data.length === 0) {
    return (
      <EmptyState title="No members yet">Invite club mates to share this workspace's models and receivers.</EmptyState>
    );
  }

  return (
    <>
      <Card className="overflow-x-auto">
        <table className="w-full text-left text-base">
          <caption className="sr-only">Members of this workspace</caption>
          <thead className="border-b border-ply-200 text-sm text-ink-700">
            <tr>
              <th scope="col" className="px-4 py-3 font-medium">
                Name
              </th>
              <th scope="col" className="px-4 py-3 font-medium">
                E-mail
              </th>
              <th scope="col" className="px-4 py-3 font-medium">
                Role
              </th>
              <th scope="col" className="px-4 py-3 font-medium">
                <span className="sr-only">Actions</span>
              </th>
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
                  {owner ? <RoleChoice workspace={workspace} member={member} /> : <RoleBadge role={member.role} />}
                </td>
                <td className="px-4 py-3 text-right">
                  {member.user.id === user.id ? (
                    <Button variant="secondary" size="sm" onClick={() => setRemoving(member)}>
                      Leave
                    </Button>
                  ) : (
                    owner && (
                      <Button
                        variant="quiet"
                        size="sm"
                        aria-label={`Remove ${member.user.name}`}
                        onClick={() => setRemoving(member)}
                      >
                        Remove
                      </Button>
                    )
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </Card>
      <p className="mt-4 max-w-prose text-sm text-ink-700">
        Owners manage members and roles; editors change models, revisions and receivers; reviewers read everything and
        give verdicts; viewers read. A workspace always keeps at least one owner.
      </p>
      {removing && (
        <RemoveDialog
          workspace={workspace}
          member={removing}
          self={removing.user.id === user.id}
          onClose={() => setRemoving(null)}
        />
      )}
    </>
  );
}

function RoleChoice({ workspace, member }: { workspace: WorkspaceMembership; member: Member }) {
  const change = useChangeRole(workspace.id);
  const toast = useToast();
  return (
    <SelectField
      label={`Role of ${member.user.name}`}
      hideLabel
      className="w-36"
      value={member.role}
      disabled={change.isPending}
      onChange={(event) => {
        const role = event.target.value as Role;
        change.mutate(
          { userId: member.user.id, role },
          {
            onSuccess: () => toast({ title: `${member.user.name} is now ${roleWord(role, true)}` }),
            onError: (error) =>
              toast({
                title: `Could not change ${member.user.name}'s role`,
                description: error.message,
                tone: 'error',
              }),
          },
        );
      }}
    >
      {ROLE_CHOICES.map((role) => (
        <option key={role.value} value={role.value}>
          {role.label}
        </option>
      ))}
    </SelectField>
  );
}

function RemoveDialog({
  workspace,
  member,
  self,
  onClose,
}: {
  workspace: WorkspaceMembership;
  member: Member;
  self: boolean;
  onClose: () => void;
}) {
  const remove = useRemoveMember(workspace.id);
  const toast = useToast();
  const navigate = useNavigate();
  const title = self ? `Leave ${workspace.name}?` : `Remove ${member.user.name}?`;
  const description = self
    ? 'You will no longer see its models, receivers or reviews. An owner can invite you again.'
    : `${member.user.name} will no longer see this workspace. Their revisions and verdicts stay in the history.`;

  return (
    <Dialog title={title} description={description} onClose={onClose}>
      {remove.isError && (
        <p role="alert" className="mb-3 text-sm text-danger-700">
          {remove.error.message}
        </p>
      )}
      <div className="flex justify-end gap-2">
        <Button variant="secondary" onClick={onClose}>
          Cancel
        </Button>
        <Button
          variant="danger"
          pending={remove.isPending}
          onClick={() =>
            remove.mutate(member.user.id, {
              onSuccess: () => {
                onClose();
                toast({ title: self ? `You left ${workspace.name}` : `${member.user.name} was removed` });
                if (self) void navigate('/', { replace: true });
              },
            })
          }
        >
          {self ? 'Leave the workspace' : 'Remove from the workspace'}
        </Button>
      </div>
    </Dialog>
  );
}
