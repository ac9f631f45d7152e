import type { Transaction } from 'sequelize';
import { isRole, type Role } from '@shared/contract/roles';
import { Membership, Workspace } from '../models';

// The one place a caller's membership is read: the policies decide on the role these
// loaders find (api/policies/), and the routes load through them before deciding.

/** A workspace and the caller's role in it. */
export interface Member {
  workspace: Workspace;
  role: Role;
}

/**
 * The caller's membership of a workspace, with the workspace; null when they are not in
 * it (or it does not exist). With `share`, the membership row is locked FOR SHARE for the
 * rest of the transaction, so a change of role waits for it to commit.
 */
export async function loadMembership(
  userId: string,
  workspaceId: string,
  transaction?: Transaction,
  options: { share?: boolean } = {},
): Promise<Member | null> {
  const membership = await Membership.findOne({
    where: { workspaceId, userId },
    include: [{ model: Workspace, as: 'workspace', required: true }],
    transaction,
    ...(transaction && options.share ? { lock: { level: transaction.LOCK.SHARE, of: Membership } } : {}),
  });
  return membership?.workspace ? { workspace: membership.workspace, role: membership.role } : null;
}

/**
 * The same read as part of a statement that loads the record itself, where a second
 * round trip would slow a hot path (a model on every save): joins the caller's
 * membership of the workspace named by `workspaceColumn`, binding the caller's id as
 * `callerParameter` (`$callerId` for Sequelize's named binds, `$3` in a prepared
 * statement), and selects its role as `caller_role` (null for a non-member). Read it
 * with `callerRole`.
 */
export function callerMembershipJoin(
  workspaceColumn: string,
  callerParameter = '$callerId',
): { select: string; join: string } {
  return {
    select: 'caller.role AS caller_role',
    join: `LEFT JOIN memberships caller ON caller.workspace_id = ${workspaceColumn} AND caller.user_id = ${callerParameter}`,
  };
}

/** The role `callerMembershipJoin` selected, from a model instance or a raw row. */
export function callerRole(row: { get(key: string): unknown } | { caller_role: unknown } | undefined): Role | null {
  const role = row && ('get' in row ? row.get('caller_role') : row.caller_role);
  return isRole(role) ? role : null;
}

/** Every workspace the user belongs to, by name, a page at a time (for the session answer). */
export async function listMemberships(userId: string, page: { limit: number; offset: number }) {
  const { rows, count } = await Membership.findAndCountAll({
    where: { userId },
    include: [{ model: Workspace, as: 'workspace', required: true }],
    order: [
      [{ model: Workspace, as: 'workspace' }, 'name', 'ASC'],
      ['createdAt', 'ASC'],
      ['id', 'ASC'],
    ],
    limit: page.limit,
    offset: page.offset,
  });
  return { members: rows.map((row) => ({ workspace: row.workspace!, role: row.role })), total: count };
}

/** The ids of the workspaces the user belongs to (to tell which linked records they may read). */
export async function memberWorkspaceIds(userId: string): Promise<Set<string>> {
  const rows = await Membership.findAll({ where: { userId }, attributes: ['workspaceId'] });
  return new Set(rows.map((row) => row.workspaceId));
}
