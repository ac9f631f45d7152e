import { Navigate } from 'react-router-dom';
import { EmptyState } from '../../components/ui/empty-state';
import { useDocumentTitle } from '../../hooks/use-document-title';
import { useCurrentWorkspace } from '../../features/workspaces/hooks/use-current-workspace';

/** `/` opens the workspace last visited (or the first); a user in none is told how to join one. */
export function HomeScreen() {
  const { fallback } = useCurrentWorkspace();
  useDocumentTitle('Home');
  if (fallback) return <Navigate to={`/w/${fallback.id}/hangar`} replace />;
  return (
    <EmptyState title="You are not in a workspace yet">
      Workspaces hold a club's or a team's models and receivers. Ask a workspace owner to invite you with this account's
      e-mail address.
    </EmptyState>
  );
}
