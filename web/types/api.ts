// Shapes the API answers with for accounts and workspaces (docs/design.md, API contract).

/** Records are keyed by UUID. */
export type Id = string;

import type { Role } from '@shared/contract/roles';

export type { Role };

export interface User {
  id: Id;
  email: string;
  name: string;
}

/** A workspace as the signed-in user sees it: with their own role in it. */
export interface WorkspaceMembership {
  id: Id;
  name: string;
  role: Role;
}

export interface Session {
  user: User;
  /** The workspaces fetched so far, by name; the session answer carries the first page. */
  workspaces: WorkspaceMembership[];
  /** How many workspaces the user belongs to in all. */
  workspacesTotal: number;
}

export interface Member {
  user: User;
  role: Role;
}
