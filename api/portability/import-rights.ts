import type { Transaction } from 'sequelize';
import { loadMembership } from '../access/membership';
import { Forbidden } from '../errors';
import { MODEL_POLICY, modelPolicy } from '../policies/model';

/**
 * The requester's right to import, read again when the job runs: the upload route
 * checked it when the job was queued, but a job may wait, and an owner who removed a
 * member or lowered their role meanwhile means the import must not happen. Inside the
 * import's transaction the membership row is locked (FOR SHARE), so a change of role
 * waits for the import to commit, or the import sees it and stores nothing.
 */
export async function requireImportRights(
  job: { workspaceId: string; requestedBy: string },
  transaction?: Transaction,
): Promise<void> {
  const member = await loadMembership(job.requestedBy, job.workspaceId, transaction, { share: true });
  const decision = modelPolicy(member?.role ?? null, 'create');
  if (decision.allowed) return;
  const required = MODEL_POLICY.create;
  if (decision.reason === 'not-member') {
    throw new Forbidden(
      'The account that asked for this import is no longer a member of the workspace, so nothing was imported.',
      { code: 'requester-not-member', details: { required } },
    );
  }
  throw new Forbidden(
    `The account that asked for this import is now ${decision.role} in the workspace, and an import needs the ${required} role or higher, so nothing was imported.`,
    { code: 'requester-role-too-low', details: { required, role: decision.role } },
  );
}
