import type { Role } from '@shared/contract/roles';

// Every API route and the lowest access that may use it, in one table. The policies
// in api/policies/ decide at run time; tests/api/route-table.test.ts calls every route
// in this table as every role, as a member of another workspace and signed out, and
// fails when a registered route is missing here (or an entry names no route).
//
//   public     anyone, signed in or not
//   signed-in  any signed-in caller; no workspace role involved
//   <role>     a member of the record's workspace with this role or a higher one;
//              a lower role gets 403, a non-member 404 (as if it did not exist),
//              a signed-out caller 401

export type Access = 'public' | 'signed-in' | Role;

export interface RouteEntry {
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  /** As registered under /api, with Express parameters (`:id`). */
  path: string;
  access: Access;
  /** Where the rule has a twist the access level alone does not say. */
  note?: string;
}

export const ROUTE_TABLE: readonly RouteEntry[] = [
  { method: 'GET', path: '/api/health', access: 'public' },
  { method: 'POST', path: '/api/check', access: 'public' },
  { method: 'GET', path: '/api/schema/setup-1.json', access: 'public' },

  { method: 'POST', path: '/api/auth/sign-up', access: 'public' },
  { method: 'POST', path: '/api/auth/sign-in', access: 'public' },
  {
    method: 'POST',
    path: '/api/auth/sign-out',
    access: 'public',
    note: 'clears the cookie, so it works with an expired one',
  },
  { method: 'POST', path: '/api/auth/sign-out-everywhere', access: 'signed-in' },
  { method: 'POST', path: '/api/auth/password', access: 'signed-in' },
  { method: 'POST', path: '/api/auth/password-reset', access: 'public' },
  {
    method: 'GET',
    path: '/api/auth/password-reset/:token',
    access: 'public',
    note: 'the mailed token is the credential',
  },
  {
    method: 'POST',
    path: '/api/auth/password-reset/:token',
    access: 'public',
    note: 'the mailed token is the credential',
  },
  { method: 'GET', path: '/api/me', access: 'signed-in' },
  { method: 'GET', path: '/api/session', access: 'public' },

  { method: 'POST', path: '/api/workspaces', access: 'signed-in' },
  { method: 'GET', path: '/api/workspaces/:ws', access: 'viewer' },
  { method: 'PATCH', path: '/api/workspaces/:ws', access: 'owner' },
  { method: 'GET', path: '/api/workspaces/:ws/members', access: 'viewer' },
  { method: 'PATCH', path: '/api/workspaces/:ws/members/:userId', access: 'owner' },
  {
    method: 'DELETE',
    path: '/api/workspaces/:ws/members/:userId',
    access: 'owner',
    note: 'any member may remove themselves (leave)',
  },
  { method: 'GET', path: '/api/workspaces/:ws/invitations', access: 'owner' },
  { method: 'POST', path: '/api/workspaces/:ws/invitations', access: 'owner' },
  { method: 'DELETE', path: '/api/workspaces/:ws/invitations/:id', access: 'owner' },
  { method: 'GET', path: '/api/invitations/:token', access: 'public', note: 'the mailed token is the credential' },
  {
    method: 'POST',
    path: '/api/invitations/:token/accept',
    access: 'public',
    note: 'signed in, or with a name and password for a new account',
  },
  { method: 'GET', path: '/api/workspaces/:ws/audit', access: 'owner' },
  { method: 'GET', path: '/api/outbox', access: 'signed-in', note: 'only while the local mail server is in use' },

  { method: 'GET', path: '/api/workspaces/:ws/models', access: 'viewer' },
  { method: 'POST', path: '/api/workspaces/:ws/models', access: 'editor' },
  { method: 'POST', path: '/api/workspaces/:ws/models/upload', access: 'editor' },
  { method: 'GET', path: '/api/models/:id', access: 'viewer' },
  { method: 'PATCH', path: '/api/models/:id', access: 'editor' },
  { method: 'POST', path: '/api/models/:id/archive', access: 'editor' },
  { method: 'POST', path: '/api/models/:id/unarchive', access: 'editor' },
  {
    method: 'POST',
    path: '/api/models/:id/fork',
    access: 'viewer',
    note: 'reads the source; needs editor in the target workspace',
  },
  { method: 'POST', path: '/api/models/:id/upload', access: 'editor' },
  { method: 'POST', path: '/api/models/:id/revisions', access: 'editor' },
  { method: 'GET', path: '/api/models/:id/revisions', access: 'viewer' },
  { method: 'GET', path: '/api/models/:id/revisions/:number', access: 'viewer' },
  { method: 'POST', path: '/api/models/:id/revert', access: 'editor' },
  { method: 'GET', path: '/api/revisions/:id', access: 'viewer' },
  { method: 'POST', path: '/api/revisions/:id/tags', access: 'editor' },
  { method: 'DELETE', path: '/api/revisions/:id/tags/:name', access: 'editor' },
  { method: 'GET', path: '/api/revisions/:id/patch', access: 'viewer' },
  { method: 'GET', path: '/api/compare', access: 'viewer', note: 'each side authorised on its own' },
  { method: 'GET', path: '/api/compare/text', access: 'viewer', note: 'each side authorised on its own' },
  { method: 'GET', path: '/api/revisions/:id/field-sheet', access: 'viewer' },
  { method: 'GET', path: '/api/revisions/:id/field-sheet.pdf', access: 'viewer' },
  { method: 'GET', path: '/api/models/:id/export.git', access: 'viewer' },
  { method: 'GET', path: '/api/workspaces/:ws/export.git', access: 'viewer' },
  {
    method: 'POST',
    path: '/api/workspaces/:ws/import',
    access: 'editor',
    note: 'answers 202 with a job; the import worker does the work',
  },
  { method: 'GET', path: '/api/workspaces/:ws/imports', access: 'editor' },
  { method: 'GET', path: '/api/workspaces/:ws/imports/:id', access: 'editor' },

  { method: 'POST', path: '/api/revisions/:id/reviews', access: 'editor' },
  { method: 'GET', path: '/api/workspaces/:ws/reviews', access: 'viewer' },
  { method: 'GET', path: '/api/models/:id/reviews', access: 'viewer' },
  { method: 'GET', path: '/api/reviews/:id', access: 'viewer' },
  { method: 'POST', path: '/api/reviews/:id/verdicts', access: 'reviewer', note: 'nobody approves their own revision' },
  { method: 'POST', path: '/api/reviews/:id/checklist', access: 'reviewer' },
  { method: 'POST', path: '/api/reviews/:id/comments', access: 'reviewer' },
  { method: 'POST', path: '/api/revisions/:id/comments', access: 'reviewer', note: 'a thread outside any review' },
  { method: 'GET', path: '/api/revisions/:id/comments', access: 'viewer' },
  { method: 'POST', path: '/api/comments/:id/replies', access: 'reviewer' },
  { method: 'POST', path: '/api/comments/:id/resolve', access: 'reviewer' },
  { method: 'POST', path: '/api/comments/:id/reopen', access: 'reviewer' },

  { method: 'GET', path: '/api/workspaces/:ws/receivers', access: 'viewer' },
  { method: 'POST', path: '/api/workspaces/:ws/receivers', access: 'editor' },
  { method: 'GET', path: '/api/receivers/:id', access: 'viewer' },
  { method: 'PATCH', path: '/api/receivers/:id', access: 'editor' },
  { method: 'GET', path: '/api/receivers/:id/reuse-check', access: 'viewer' },
  { method: 'POST', path: '/api/receivers/:id/install', access: 'editor' },
  { method: 'POST', path: '/api/receivers/:id/remove', access: 'editor' },
  { method: 'POST', path: '/api/receivers/:id/apply', access: 'editor' },
  { method: 'GET', path: '/api/receivers/:id/history', access: 'viewer' },

  { method: 'GET', path: '/api/models/:id/provenance', access: 'viewer' },
  { method: 'GET', path: '/api/models/:id/provenance/history', access: 'viewer' },
  {
    method: 'GET',
    path: '/api/models/:id/source-updates',
    access: 'viewer',
    note: 'a fork only; the caller must also read the source',
  },
  {
    method: 'POST',
    path: '/api/models/:id/source-updates',
    access: 'editor',
    note: 'a fork only; the caller must also read the source',
  },
  { method: 'GET', path: '/api/workspaces/:ws/rules', access: 'viewer' },
  { method: 'PUT', path: '/api/workspaces/:ws/rules', access: 'owner' },
];

export const routeKey = (entry: { method: string; path: string }): string => `${entry.method} ${entry.path}`;

interface RouterLayer {
  route?: { path: string; methods: Record<string, boolean> };
  handle?: { stack?: RouterLayer[] };
  rawPath?: unknown;
}

/** Every method and path an Express 5 app has registered, walking nested routers. */
export function registeredRoutes(app: { router: { stack: RouterLayer[] } }): { method: string; path: string }[] {
  const found: { method: string; path: string }[] = [];
  const walk = (stack: RouterLayer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const method of Object.keys(layer.route.methods))
          if (method !== '_all') found.push({ method: method.toUpperCase(), path: `${prefix}${layer.route.path}` });
      } else if (layer.handle?.stack) {
        walk(
          layer.handle.stack,
          typeof layer.rawPath === 'string' && layer.rawPath !== '/' ? `${prefix}${layer.rawPath}` : prefix,
        );
      }
    }
  };
  walk(app.router.stack, '');
  return found;
}
