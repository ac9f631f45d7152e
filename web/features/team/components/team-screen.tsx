import { PageHeader } from '../../../components/ui/page-header';
import { useCurrentWorkspace } from '../../workspaces/hooks/use-current-workspace';
import { MemberList } from './member-list';

export function TeamScreen() {
  const { inUrl } = useCurrentWorkspace();
  if (!inUrl) return null;
  return (
    <>
      <PageHeader title="Team" documentTitle={`Team · ${inUrl.name}`} description={`Who shares ${inUrl.name}, and what each may do.`} />
      <MemberList workspaceId={inUrl.id} />
    </>
  );
}
