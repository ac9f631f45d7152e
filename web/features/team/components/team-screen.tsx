import { PageHeader } from '../../../components/ui/page-header';
import { useCurrentWorkspace } from '../../workspaces/hooks/use-current-workspace';
import { AuditList } from './audit-list';
import { ClubRulesPanel } from './club-rules-panel';
import { InviteForm } from './invite-form';
import { MemberList } from './member-list';
import { PendingInvitations } from './pending-invitations';

export function TeamScreen() {
  const { inUrl } = useCurrentWorkspace();
  if (!inUrl) return null;
  const owner = inUrl.role === 'owner';
  return (
    <>
      <PageHeader
        title="Team"
        documentTitle={`Team · ${inUrl.name}`}
        description={`Who shares ${inUrl.name}, and what each may do.`}
      />
      <section aria-labelledby="members-heading">
        <h2 id="members-heading" className="sr-only">
          Members
        </h2>
        <MemberList workspace={inUrl} />
      </section>
      {owner && (
        <div className="mt-8 grid gap-6 lg:grid-cols-2">
          <InviteForm workspaceId={inUrl.id} />
          <PendingInvitations workspaceId={inUrl.id} />
        </div>
      )}
      <section className="mt-8" aria-labelledby="rules-heading">
        <ClubRulesPanel workspaceId={inUrl.id} owner={owner} />
      </section>
      {owner && (
        <div className="mt-8">
          <AuditList workspaceId={inUrl.id} />
        </div>
      )}
    </>
  );
}
