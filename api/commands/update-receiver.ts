import type { Sequelize } from 'sequelize';
import type { MarkColour } from '@shared/reuse/receiver-fields';
import type { StoredSettings } from '@shared/reuse/stored-settings';
import { Unprocessable } from '../errors';
import { Receiver, type User } from '../models';
import { recordReceiverEvent } from '../audit/record-receiver-event';

export interface ReceiverChanges {
  label?: string;
  mark?: string | null;
  mark_colour?: MarkColour | null;
  outputs?: number;
  notes?: string;
  /** Settings read off the unit itself (not applied from a slot: that is apply-receiver-settings). */
  stored_settings?: StoredSettings | null;
}

const FIELD_OF = {
  label: 'label',
  mark: 'mark',
  mark_colour: 'markColour',
  outputs: 'outputs',
  notes: 'notes',
  stored_settings: 'storedSettings',
} as const;

/**
 * Changes a unit's shelf record. The row is locked first, so a change and an install,
 * removal or apply on one unit queue, and each is checked against what the one before left.
 */
export function updateReceiver(
  sequelize: Sequelize,
  input: { receiverId: string; changes: ReceiverChanges; actor: User },
): Promise<Receiver> {
  const { changes, actor } = input;
  return sequelize.transaction(async (transaction) => {
    const receiver = await Receiver.findByPk(input.receiverId, {
      transaction,
      lock: transaction.LOCK.UPDATE,
      rejectOnEmpty: true,
    });
    const outputs = changes.outputs ?? receiver.outputs;
    const stored = changes.stored_settings !== undefined ? changes.stored_settings : receiver.storedSettings;
    const beyond = (stored?.pins ?? []).filter((entry) => entry.pin > outputs).map((entry) => entry.pin);
    if (beyond.length > 0) {
      throw new Unprocessable(
        `The stored settings use pin ${beyond.join(', ')}, above the unit's ${outputs} outputs.`,
        {
          code: 'pins-beyond-outputs',
          details: { fields: { outputs: `The stored settings use pins up to ${Math.max(...beyond)}.` }, pins: beyond },
        },
      );
    }

    const before: Record<string, unknown> = {};
    const after: Record<string, unknown> = {};
    for (const [key, field] of Object.entries(FIELD_OF) as [
      keyof ReceiverChanges,
      (typeof FIELD_OF)[keyof ReceiverChanges],
    ][]) {
      if (changes[key] === undefined) continue;
      const previous = receiver[field] ?? null;
      if (JSON.stringify(previous) === JSON.stringify(changes[key])) continue;
      before[key] = previous;
      after[key] = changes[key];
    }
    if (Object.keys(after).length === 0) return receiver;

    const settingsChanged = 'stored_settings' in after;
    await receiver.update(
      {
        ...(after.label !== undefined ? { label: changes.label } : {}),
        ...('mark' in after ? { mark: changes.mark ?? null } : {}),
        ...('mark_colour' in after ? { markColour: changes.mark_colour ?? null } : {}),
        ...(after.outputs !== undefined ? { outputs: changes.outputs } : {}),
        ...(after.notes !== undefined ? { notes: changes.notes } : {}),
        ...(settingsChanged
          ? {
              storedSettings: changes.stored_settings ?? null,
              settingsRecordedAt: changes.stored_settings ? new Date() : null,
            }
          : {}),
      },
      { transaction },
    );
    await recordReceiverEvent(
      {
        workspaceId: receiver.workspaceId,
        actor,
        action: 'receiver.updated',
        receiverId: receiver.id,
        details: { before, after },
      },
      transaction,
    );
    return receiver;
  });
}
