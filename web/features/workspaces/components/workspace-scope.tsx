import { useEffect } from 'react';
import { Link, Outlet } from 'react-router-dom';
import { EmptyState } from '../../../components/ui/empty-state';
import { useDocumentTitle } from '../../../hooks/use-document-title';
import { useCurrentWorkspace } from '../hooks/use-current-workspace';
import { rememberWorkspace } from '../last-workspace';

/** Renders a workspace's screens only for a workspace the user is a member of. */
export function WorkspaceScope() {
  const { inUrl } = useCurrentWorkspace();

  useEffect(() => {
    if (inUrl) rememberWorkspace(inUrl.id);
  }, [inUrl]);

  if (!inUrl) return <UnknownWorkspace />;
  return <Outlet />;
}

function UnknownWorkspace() {
  useDocumentTitle('Workspace not found');
  return (
    <EmptyState title="Workspace not found" action={<Link to="/">Go to your workspace</Link>}>
      This workspace does not exist, or you are not one of its members.
    </EmptyState>
  );
}
