import { useMatch } from 'react-router-dom';
import { useSession } from '../../auth/hooks/use-session';
import type { WorkspaceMembership } from '../../../types/api';
import { lastWorkspaceId } from '../last-workspace';

export interface CurrentWorkspace {
  /** The workspace named in the URL (`/w/:wsId/...`), null when the URL names none or one the user is not in. */
  inUrl: WorkspaceMembership | null;
  /** The id in the URL, even when it matches no workspace of the user. */
  urlId: string | null;
  /** The workspace to offer when the URL names none: the last one visited, or the first. */
  fallback: WorkspaceMembership | null;
  /** The rest of the path after the workspace: `hangar`, `team`... */
  section: string | null;
}

export function useCurrentWorkspace(): CurrentWorkspace {
  const { workspaces } = useSession();
  const match = useMatch('/w/:wsId/*');
  const urlId = match?.params.wsId ?? null;
  const find = (id: string | null) => (id === null ? undefined : workspaces.find((ws) => ws.id === id));
  const inUrl = find(urlId) ?? null;
  const fallback = inUrl ?? find(lastWorkspaceId()) ?? workspaces[0] ?? null;
  const section = match?.params['*']?.split('/')[0] || null;
  return { inUrl, urlId, fallback, section };
}
