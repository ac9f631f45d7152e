import type { Sequelize, Transaction } from 'sequelize';
import { Conflict } from '../errors';
import { Receiver, ReceiverInstall, SetupModel, type User } from '../models';
import { recordReceiverEvent } from '../audit/record-receiver-event';

/** Ends a stay (the unit leaves the slot) and records it; the caller holds the receiver's lock. */
export async function closeInstall(
  receiver: Receiver,
  install: ReceiverInstall,
  actor: User,
  at: Date,
  extra: Record<string, unknown>,
  transaction: Transaction,
): Promise<ReceiverInstall> {
  await install.update({ removedAt: at, removedBy: actor.id }, { transaction });
  install.remover = actor;
  await recordReceiverEvent(
    {
      workspaceId: receiver.workspaceId,
      actor,
      action: 'receiver.removed',
      receiverId: receiver.id,
      createdAt: at,
      details: {
        install_id: install.id,
        model_id: install.modelId,
        model_name: install.model?.name ?? null,
        slot: install.slot,
        ...extra,
      },
    },
    transaction,
  );
  return install;
}

/** Takes the unit out of its slot and back onto the shelf; 409 when it is not installed anywhere. */
export async function removeReceiver(
  sequelize: Sequelize,
  receiverId: string,
  actor: User,
): Promise<{ receiver: Receiver; install: ReceiverInstall }> {
  return sequelize.transaction(async (transaction) => {
    const receiver = await Receiver.findByPk(receiverId, {
      transaction,
      lock: transaction.LOCK.UPDATE,
      rejectOnEmpty: true,
    });
    const install = await ReceiverInstall.findOne({
      where: { receiverId, removedAt: null },
      include: [{ model: SetupModel, as: 'model', attributes: ['id', 'name'] }],
      transaction,
    });
    if (!install) throw new Conflict(`${receiver.label} is not installed anywhere.`, { code: 'not-installed' });
    await closeInstall(receiver, install, actor, new Date(), {}, transaction);
    return { receiver, install };
  });
}
