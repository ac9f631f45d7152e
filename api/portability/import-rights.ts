import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { Forbidden } from '../errors';
import { MODEL_POLICY } from '../policies/model';
import { isRole, roleAtLeast } from '@shared/contract/roles';

/**
 * The requester's right to import, read again when the job runs: the upload route
 * checked it when the job was queued, but a job may wait, and an owner who removed a
 * member or lowered their role meanwhile means the import must not happen. Inside the
 * import's transaction the membership row is locked (FOR SHARE), so a change of role
 * waits for the import to commit, or the import sees it and stores nothing.
 */
export async function requireImportRights(
  sequelize: Sequelize,
  job: { workspaceId: string; requestedBy: string },
  transaction?: Transaction,
): Promise<void> {
  const [row] = await sequelize.query<{ role: string }>(
    `SELECT role FROM memberships WHERE workspace_id = $workspaceId AND user_id = $userId${transaction ? ' FOR SHARE' : ''}`,
    { bind: { workspaceId: job.workspaceId, userId: job.requestedBy }, type: QueryTypes.SELECT, transaction },
  );
  const required = MODEL_POLICY.create;
  if (!row || !isRole(row.role)) {
    throw new Forbidden(
      'The account that asked for this import is no longer a member of the workspace, so nothing was imported.',
      { code: 'requester-not-member', details: { required } },
    );
  }
  if (!roleAtLeast(row.role, required)) {
    throw new Forbidden(
      `The account that asked for this import is now ${row.role} in the workspace, and an import needs the ${required} role or higher, so nothing was imported.`,
      { code: 'requester-role-too-low', details: { required, role: row.role } },
    );
  }
}
