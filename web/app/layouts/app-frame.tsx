import { Suspense } from 'react';
import { Link, Navigate, Outlet, useLocation } from 'react-router-dom';
import { useMe } from '../../features/auth/api/get-me';
import { useSignOut } from '../../features/auth/api/sign-out';
import { SessionContext, useSession } from '../../features/auth/hooks/use-session';
import { WorkspaceSwitcher } from '../../features/workspaces/components/workspace-switcher';
import { useCurrentWorkspace } from '../../features/workspaces/hooks/use-current-workspace';
import { isUnauthorized } from '../../lib/api-client';
import { LogoMark } from '../../components/brand/logo-mark';
import { Button } from '../../components/ui/button';
import { ErrorState } from '../../components/ui/error-state';
import { LoadingState } from '../../components/ui/loading-state';
import { useToast } from '../../components/ui/toast';
import { NavTabs, type NavItem } from '../../components/layouts/nav-tabs';
import { OfflineBanner } from '../../components/layouts/offline-banner';

export interface FrameLink {
  /** The path under `/w/:wsId/`, or an absolute path for links outside a workspace. */
  path: string;
  label: string;
}

export interface AppFrameProps {
  workspaceLinks: FrameLink[];
  /** Tools for development (the outbox), set apart from the product's own screens. */
  devLinks: FrameLink[];
}

/** The signed-in app: waits for the session, sends the signed-out to sign-in, then frames the screens. */
export function AppFrame(props: AppFrameProps) {
  const me = useMe();
  const location = useLocation();

  if (me.isPending) {
    return (
      <div className="min-h-screen pt-24">
        <LoadingState label="Opening Bindery…" />
      </div>
    );
  }
  if (me.isError) {
    if (isUnauthorized(me.error)) {
      const next = `${location.pathname}${location.search}`;
      const to = next === '/' ? '/sign-in' : `/sign-in?next=${encodeURIComponent(next)}`;
      return <Navigate to={to} replace />;
    }
    return (
      <div className="mx-auto max-w-xl px-4 pt-24">
        <ErrorState title="Bindery could not load your account" error={me.error} onRetry={() => void me.refetch()} />
      </div>
    );
  }
  return (
    <SessionContext.Provider value={me.data}>
      <SignedInFrame {...props} />
    </SessionContext.Provider>
  );
}

function SignedInFrame({ workspaceLinks, devLinks }: AppFrameProps) {
  const { user } = useSession();
  const { fallback } = useCurrentWorkspace();
  const signOut = useSignOut();
  const toast = useToast();

  const items: NavItem[] = fallback
    ? workspaceLinks.map((link) => ({ to: `/w/${fallback.id}/${link.path}`, label: link.label }))
    : [];
  const devItems: NavItem[] = devLinks.map((link) => ({ to: link.path, label: link.label }));

  return (
    <div className="min-h-screen">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:z-50 focus:rounded-md focus:bg-paper-raised focus:px-3 focus:py-2"
      >
        Skip to content
      </a>
      <header className="border-b border-ply-300 bg-paper-raised">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-4 gap-y-2 px-4 pt-3 sm:px-6">
          <Link to="/" className="flex items-center gap-2 rounded-md text-ink-900 no-underline hover:text-ink-900">
            <LogoMark className="h-8 w-8" />
            <span className="text-xl font-semibold tracking-tight">Bindery</span>
          </Link>
          <WorkspaceSwitcher />
          <div className="ml-auto flex min-w-0 items-center gap-3">
            <Link to="/help/format" className="rounded-md text-sm text-ink-700">
              Format help
            </Link>
            <Link
              to="/account"
              className="max-w-48 min-w-0 truncate rounded-md text-sm text-ink-700 lg:max-w-none"
              title={`${user.email}: account and password`}
            >
              <span className="sr-only lg:not-sr-only">Signed in as </span>
              <span className="font-medium text-ink-900">{user.name}</span>
            </Link>
            <Button
              variant="secondary"
              size="sm"
              pending={signOut.isPending}
              onClick={() =>
                signOut.mutate(undefined, {
                  onSuccess: () => toast({ title: 'Signed out', tone: 'info' }),
                  onError: (error) => toast({ title: 'Could not sign out', description: error.message, tone: 'error' }),
                })
              }
            >
              Sign out
            </Button>
          </div>
        </div>
        <div className="mx-auto mt-1 flex max-w-6xl flex-wrap items-end justify-between gap-x-4 px-2 sm:px-4">
          <NavTabs items={items} label="Workspace" />
          {devItems.length > 0 && (
            <div className="flex items-center gap-1">
              <span className="hidden text-xs font-medium tracking-wide text-ink-500 uppercase md:inline">
                Development
              </span>
              <NavTabs items={devItems} label="Development tools" />
            </div>
          )}
        </div>
      </header>
      <OfflineBanner />
      <main id="main" className="mx-auto max-w-6xl px-4 py-8 sm:px-6">
        <Suspense fallback={<LoadingState />}>
          <Outlet />
        </Suspense>
      </main>
    </div>
  );
}
