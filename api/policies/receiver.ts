import type { Request } from 'express';
import type { Transaction } from 'sequelize';
import { NotFound } from '../errors';
import { Receiver, SetupModel } from '../models';
import { idSchema } from '../validation';
import type { Role } from '@shared/contract/roles';
import { requireRole, type WorkspaceAccess } from './workspace';

// The shelf: everyone in the workspace reads it; editors and owners add units, change
// their records, install, remove and record applied settings.
export const RECEIVER_POLICY = {
  read: 'viewer',
  write: 'editor',
} as const satisfies Record<string, Role>;

export type ReceiverAction = keyof typeof RECEIVER_POLICY;

export interface ReceiverAccess extends WorkspaceAccess {
  receiver: Receiver;
}

export function authorizeShelf(req: Request, workspaceId: unknown, action: ReceiverAction): Promise<WorkspaceAccess> {
  return requireRole(req, workspaceId, RECEIVER_POLICY[action]);
}

/**
 * The receiver and the caller's access to its workspace. A receiver of a workspace the
 * caller is not in answers exactly like one that does not exist. With a transaction,
 * the row is locked for the rest of it, so install, remove and apply on one unit queue.
 */
export async function authorizeReceiver(
  req: Request,
  receiverId: unknown,
  action: ReceiverAction,
  transaction?: Transaction,
): Promise<ReceiverAccess> {
  const notFound = new NotFound('No such receiver.', { code: 'receiver-not-found' });
  const id = idSchema.safeParse(receiverId);
  if (!id.success) throw notFound;
  const receiver = await Receiver.findByPk(id.data, transaction ? { transaction, lock: transaction.LOCK.UPDATE } : {});
  if (!receiver) throw notFound;
  try {
    return { ...(await requireRole(req, receiver.workspaceId, RECEIVER_POLICY[action])), receiver };
  } catch (error) {
    throw error instanceof NotFound ? notFound : error;
  }
}

/** A model of the receiver's own workspace: a unit goes only into the hangar its shelf belongs to. */
export async function modelOnShelf(
  workspaceId: string,
  modelId: string,
  transaction?: Transaction,
): Promise<SetupModel> {
  const model = await SetupModel.findOne({ where: { id: modelId, workspaceId }, transaction });
  if (!model) throw new NotFound('No such model in this workspace.', { code: 'model-not-found' });
  return model;
}
