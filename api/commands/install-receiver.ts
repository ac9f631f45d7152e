import { UniqueConstraintError, type Sequelize, type Transaction } from 'sequelize';
import { Conflict } from '../errors';
import { Receiver, ReceiverInstall, SetupModel, type User } from '../models';
import { checkAgainstLatest, type SlotCheck } from '../queries/receiver-slot';
import { recordReceiverEvent } from '../audit/record-receiver-event';
import { closeInstall } from './remove-receiver';

export interface InstallInput {
  receiverId: string;
  model: SetupModel;
  slot: string;
  actor: User;
  /** Take the unit out of where it is now, in the same transaction. */
  move: boolean;
}

export interface Installed extends SlotCheck {
  receiver: Receiver;
  install: ReceiverInstall;
  /** The stay the move ended, when the unit came from another slot. */
  previous: ReceiverInstall | null;
}

async function openInstallOf(receiverId: string, transaction: Transaction) {
  return ReceiverInstall.findOne({
    where: { receiverId, removedAt: null },
    include: [{ model: SetupModel, as: 'model', attributes: ['id', 'name'] }],
    transaction,
  });
}

async function occupantOf(modelId: string, slot: string, transaction: Transaction) {
  return ReceiverInstall.findOne({
    where: { modelId, slot, removedAt: null },
    include: [{ model: Receiver, as: 'receiver', attributes: ['id', 'label'] }],
    transaction,
  });
}

function slotOccupied(model: SetupModel, slot: string, occupant: { id: string; label: string } | null): Conflict {
  return new Conflict(
    `Slot ${slot} of ${model.name} already holds ${occupant ? occupant.label : 'another unit'}; remove it first.`,
    {
      code: 'slot-occupied',
      details: { model: { id: model.id, name: model.name }, slot, receiver: occupant },
    },
  );
}

/**
 * Puts a unit into a model's receiver slot and runs its reuse check against the
 * model's latest revision. A unit still installed elsewhere is refused unless `move`
 * is set, which ends that stay and begins this one in one transaction. The receiver row
 * is locked first so two installs of one unit queue; the partial unique indexes settle
 * two units racing for one slot.
 */
export async function installReceiver(sequelize: Sequelize, input: InstallInput): Promise<Installed> {
  try {
    return await sequelize.transaction(async (transaction) => {
      const receiver = await Receiver.findByPk(input.receiverId, {
        transaction,
        lock: transaction.LOCK.UPDATE,
        rejectOnEmpty: true,
      });
      const placed = await checkAgainstLatest(receiver, input.model, input.slot, transaction);
      const current = await openInstallOf(receiver.id, transaction);
      if (current && current.modelId === input.model.id && current.slot === input.slot) {
        throw new Conflict(`${receiver.label} is already installed in slot ${input.slot} of ${input.model.name}.`, {
          code: 'already-installed',
          details: { install_id: current.id },
        });
      }
      if (current && !input.move) {
        throw new Conflict(
          `${receiver.label} is still installed in slot ${current.slot} of ${current.model?.name ?? 'another model'}. Remove it from there first, or move it in one step.`,
          {
            code: 'installed-elsewhere',
            details: {
              install_id: current.id,
              model: { id: current.modelId, name: current.model?.name ?? null },
              slot: current.slot,
              since: current.installedAt.toISOString(),
            },
          },
        );
      }
      const occupant = await occupantOf(input.model.id, input.slot, transaction);
      if (occupant)
        throw slotOccupied(
          input.model,
          input.slot,
          occupant.receiver ? { id: occupant.receiver.id, label: occupant.receiver.label } : null,
        );

      const now = new Date();
      if (current)
        await closeInstall(
          receiver,
          current,
          input.actor,
          now,
          { moved_to: { model_id: input.model.id, model_name: input.model.name, slot: input.slot } },
          transaction,
        );

      const install = await ReceiverInstall.create(
        {
          receiverId: receiver.id,
          modelId: input.model.id,
          slot: input.slot,
          revisionId: placed.revision.id,
          installedAt: now,
          installedBy: input.actor.id,
        },
        { transaction },
      );
      install.model = input.model;
      install.installer = input.actor;
      await recordReceiverEvent(
        {
          workspaceId: receiver.workspaceId,
          actor: input.actor,
          action: 'receiver.installed',
          receiverId: receiver.id,
          createdAt: now,
          details: {
            install_id: install.id,
            model_id: input.model.id,
            model_name: input.model.name,
            slot: input.slot,
            revision_id: placed.revision.id,
            revision_number: placed.revision.number,
            ready: placed.check.ready,
            changes: placed.check.changes.length,
            moved_from: current
              ? { model_id: current.modelId, model_name: current.model?.name ?? null, slot: current.slot }
              : null,
          },
        },
        transaction,
      );
      return { ...placed, receiver, install, previous: current };
    });
  } catch (error) {
    // Another request filled the slot between our look and our insert.
    if (error instanceof UniqueConstraintError) throw slotOccupied(input.model, input.slot, null);
    throw error;
  }
}
