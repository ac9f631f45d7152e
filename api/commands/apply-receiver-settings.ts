import type { Sequelize } from 'sequelize';
import { reuseCheck } from '@shared/reuse/reuse-check';
import { Conflict, Unprocessable } from '../errors';
import { Receiver, ReceiverInstall, SetupModel, type User } from '../models';
import { checkAgainstLatest, unitOf, type SlotCheck } from '../queries/receiver-slot';
import { recordReceiverEvent } from '../audit/record-receiver-event';

export interface Applied extends SlotCheck {
  receiver: Receiver;
  install: ReceiverInstall;
}

/**
 * "I have applied these settings": the pilot says the unit now holds what its slot in
 * the model's latest revision asks for, so those become its stored settings, recorded
 * with what it held before. `revisionId`, when given, is the revision whose check the
 * pilot worked from; a newer one since is refused rather than recorded unseen.
 */
export async function applyReceiverSettings(
  sequelize: Sequelize,
  input: { receiverId: string; actor: User; revisionId?: string },
): Promise<Applied> {
  return sequelize.transaction(async (transaction) => {
    const receiver = await Receiver.findByPk(input.receiverId, {
      transaction,
      lock: transaction.LOCK.UPDATE,
      rejectOnEmpty: true,
    });
    const install = await ReceiverInstall.findOne({
      where: { receiverId: receiver.id, removedAt: null },
      include: [{ model: SetupModel, as: 'model' }],
      transaction,
    });
    if (!install?.model) {
      throw new Conflict(
        `${receiver.label} is not installed anywhere: install it into a slot first, then apply that slot's settings.`,
        { code: 'not-installed' },
      );
    }
    const placed = await checkAgainstLatest(receiver, install.model, install.slot, transaction);
    if (input.revisionId && input.revisionId !== placed.revision.id) {
      throw new Conflict(
        `${install.model.name} has a newer revision (${placed.revision.number}) than the one these settings came from; check again before applying.`,
        {
          code: 'stale-revision',
          details: { latest: { id: placed.revision.id, number: placed.revision.number } },
        },
      );
    }
    const blocking = placed.check.notes.filter((note) => note.blocking);
    if (blocking.length > 0) {
      throw new Unprocessable(
        `${receiver.label} cannot hold this slot's settings: ${blocking.map((note) => note.message).join(' ')}`,
        {
          code: 'unit-cannot-carry',
          details: { notes: blocking },
        },
      );
    }
    const before = receiver.storedSettings ?? null;
    const now = new Date();
    await receiver.update({ storedSettings: placed.check.target, settingsRecordedAt: now }, { transaction });
    await recordReceiverEvent(
      {
        workspaceId: receiver.workspaceId,
        actor: input.actor,
        action: 'receiver.settings-applied',
        receiverId: receiver.id,
        createdAt: now,
        details: {
          install_id: install.id,
          model_id: install.modelId,
          model_name: install.model.name,
          slot: install.slot,
          revision_id: placed.revision.id,
          revision_number: placed.revision.number,
          changes: placed.check.changes,
          before,
          after: placed.check.target,
        },
      },
      transaction,
    );
    return {
      ...placed,
      check: reuseCheck(unitOf(receiver), placed.slot, placed.revision.findings, placed.setup),
      receiver,
      install,
    };
  });
}
