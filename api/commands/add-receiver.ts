import type { Sequelize } from 'sequelize';
import type { MarkColour } from '@shared/reuse/receiver-fields';
import type { StoredSettings } from '@shared/reuse/stored-settings';
import { Receiver, type User, type Workspace } from '../models';
import { recordReceiverEvent } from '../audit/record-receiver-event';

export interface AddReceiverInput {
  workspace: Workspace;
  actor: User;
  label: string;
  mark?: string | null;
  mark_colour?: MarkColour | null;
  outputs: number;
  notes?: string;
  stored_settings?: StoredSettings | null;
}

/** Puts a unit on the shelf, free, with whatever settings it is known to hold. */
export async function addReceiver(sequelize: Sequelize, input: AddReceiverInput): Promise<Receiver> {
  return sequelize.transaction(async (transaction) => {
    const stored = input.stored_settings ?? null;
    const receiver = await Receiver.create(
      {
        workspaceId: input.workspace.id,
        label: input.label,
        mark: input.mark ?? null,
        markColour: input.mark_colour ?? null,
        outputs: input.outputs,
        notes: input.notes ?? '',
        storedSettings: stored,
        settingsRecordedAt: stored ? new Date() : null,
        createdBy: input.actor.id,
      },
      { transaction },
    );
    await recordReceiverEvent(
      {
        workspaceId: input.workspace.id,
        actor: input.actor,
        action: 'receiver.added',
        receiverId: receiver.id,
        details: { label: receiver.label, outputs: receiver.outputs, stored_settings: stored },
      },
      transaction,
    );
    return receiver;
  });
}
