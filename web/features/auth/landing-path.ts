import type { Session } from '../../types/api';

/**
 * Where to go after signing in: back to the page that sent the user to sign in, when
 * that is a page of this app, otherwise the first workspace's hangar.
 */
export function landingPath(session: Session, next: string | null): string {
  if (next && next.startsWith('/') && !next.startsWith('//') && !next.includes('\\') && !next.startsWith('/sign-in'))
    return next;
  const first = session.workspaces[0];
  return first ? `/w/${first.id}/hangar` : '/';
}
