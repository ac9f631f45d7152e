import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Op, type Transaction } from 'sequelize';
import { parse } from 'yaml';
import { createReceiverSchema } from '@shared/reuse/receiver-fields';
import { findSlot, reuseCheck, type ReuseCheck } from '@shared/reuse/reuse-check';
import { recordReceiverEvent } from '../../audit/record-receiver-event';
import { Receiver, ReceiverInstall, Revision, SetupModel, User, Workspace } from '../../models';
import { setupOf } from '../../queries/receiver-slot';
import { DEMO_WORKSPACE_NAME } from '../demo-data';
import type { SeedContext } from '../index';

// The demo club's shelf (invented): the Kestrel's fuselage unit in its slot, the club
// trainer's unit in its cabin, a unit that came out of a retired single-receiver
// trainer with its throttle pin still failing safe to 988 µs (meant for the Kestrel's
// empty wing slot, where its reuse check lists the remap, that failsafe and telemetry
// off), and a spare never set up. Units in a slot hold what that slot asks for, as if
// applied at the bench.

interface Stay {
  model: string;
  slot: string;
  at: string;
  by: 'owner' | 'editor';
}

interface DemoUnit {
  /** A stored-settings fixture in fixtures/reuse/, or the fields themselves. */
  fixture?: string;
  fields?: Record<string, unknown>;
  addedAt: string;
  by: 'owner' | 'editor';
  stay?: Stay;
}

const UNITS: DemoUnit[] = [
  {
    fields: {
      label: 'Kestrel fuselage unit',
      mark: 'Blue tape',
      mark_colour: 'blue',
      outputs: 8,
      notes: 'Primary: the only unit that reports telemetry in the Kestrel.',
    },
    addedAt: '2025-02-08T10:00:00Z',
    by: 'owner',
    stay: { model: 'Kestrel Mk II', slot: 'fuselage', at: '2025-02-08T10:30:00Z', by: 'owner' },
  },
  {
    fixture: 'six-output-unit.yaml',
    addedAt: '2024-09-14T08:30:00Z',
    by: 'editor',
    stay: { model: 'Meadowlark 40', slot: 'cabin', at: '2024-09-14T09:20:00Z', by: 'editor' },
  },
  { fixture: 'trainer-unit.yaml', addedAt: '2026-04-20T18:00:00Z', by: 'editor' },
  {
    fields: {
      label: 'Spare 8-output unit',
      outputs: 8,
      notes: 'New in the box from the winter swap meet; not bound to anything yet.',
    },
    addedAt: '2026-01-17T11:00:00Z',
    by: 'owner',
  },
];

const fixtureFields = (name: string): Record<string, unknown> =>
  parse(readFileSync(fileURLToPath(new URL(`../../../fixtures/reuse/${name}`, import.meta.url)), 'utf8')) as Record<
    string,
    unknown
  >;

/** The unit's reuse check against the slot in the revision that was the model's latest at `at`. */
async function checkInSlot(
  model: SetupModel,
  slot: string,
  receiver: Receiver,
  at: Date,
  transaction: Transaction,
): Promise<{ revision: Revision; check: ReuseCheck }> {
  const revision = await Revision.findOne({
    where: { modelId: model.id, createdAt: { [Op.lte]: at } },
    order: [['number', 'DESC']],
    transaction,
  });
  const setup = revision && setupOf(revision);
  const found = setup && findSlot(setup, slot);
  if (!revision || !found)
    throw new Error(
      `Demo seed: ${model.name} had no receiver slot "${slot}" on ${at.toISOString()}; step 0002 makes it.`,
    );
  return { revision, check: reuseCheck({ outputs: receiver.outputs, stored: receiver.storedSettings ?? null }, found) };
}

export async function run({ sequelize }: SeedContext): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const workspace = await Workspace.findOne({
      where: { name: DEMO_WORKSPACE_NAME },
      order: [['createdAt', 'ASC']],
      transaction,
    });
    if (!workspace)
      throw new Error(`Demo seed: the workspace "${DEMO_WORKSPACE_NAME}" is missing; step 0001 makes it.`);
    const members = {
      owner: await User.findOne({ where: { email: 'owner@demo.example' }, transaction }),
      editor: await User.findOne({ where: { email: 'editor@demo.example' }, transaction }),
    };
    if (!members.owner || !members.editor)
      throw new Error('Demo seed: the demo accounts are missing; step 0001 makes them.');
    const who = (by: 'owner' | 'editor') => members[by]!;

    for (const unit of UNITS) {
      const fields = createReceiverSchema.parse(unit.fields ?? fixtureFields(unit.fixture!));
      const addedAt = new Date(unit.addedAt);
      const receiver = await Receiver.create(
        {
          workspaceId: workspace.id,
          label: fields.label,
          mark: fields.mark ?? null,
          markColour: fields.mark_colour ?? null,
          outputs: fields.outputs,
          notes: fields.notes ?? '',
          storedSettings: fields.stored_settings ?? null,
          settingsRecordedAt: fields.stored_settings ? addedAt : null,
          createdBy: who(unit.by).id,
          createdAt: addedAt,
          updatedAt: addedAt,
        },
        { transaction, silent: true },
      );
      await recordReceiverEvent(
        {
          workspaceId: workspace.id,
          actor: who(unit.by),
          action: 'receiver.added',
          receiverId: receiver.id,
          createdAt: addedAt,
          details: { label: receiver.label, outputs: receiver.outputs, stored_settings: receiver.storedSettings },
        },
        transaction,
      );
      if (!unit.stay) continue;

      const model = await SetupModel.findOne({
        where: { workspaceId: workspace.id, name: unit.stay.model },
        transaction,
      });
      if (!model) throw new Error(`Demo seed: the model "${unit.stay.model}" is missing; step 0002 makes it.`);
      const at = new Date(unit.stay.at);
      const { revision, check } = await checkInSlot(model, unit.stay.slot, receiver, at, transaction);
      const { changes, target } = check;
      const before = receiver.storedSettings ?? null;
      const install = await ReceiverInstall.create(
        {
          receiverId: receiver.id,
          modelId: model.id,
          slot: unit.stay.slot,
          revisionId: revision.id,
          installedAt: at,
          installedBy: who(unit.stay.by).id,
        },
        { transaction },
      );
      await recordReceiverEvent(
        {
          workspaceId: workspace.id,
          actor: who(unit.stay.by),
          action: 'receiver.installed',
          receiverId: receiver.id,
          createdAt: at,
          details: {
            install_id: install.id,
            model_id: model.id,
            model_name: model.name,
            slot: unit.stay.slot,
            revision_id: revision.id,
            revision_number: revision.number,
            ready: changes.length === 0,
            changes: changes.length,
            moved_from: null,
          },
        },
        transaction,
      );
      if (changes.length === 0) continue;
      const appliedAt = new Date(at.getTime() + 20 * 60_000);
      await receiver.update({ storedSettings: target, settingsRecordedAt: appliedAt }, { transaction, silent: true });
      await recordReceiverEvent(
        {
          workspaceId: workspace.id,
          actor: who(unit.stay.by),
          action: 'receiver.settings-applied',
          receiverId: receiver.id,
          createdAt: appliedAt,
          details: {
            install_id: install.id,
            model_id: model.id,
            model_name: model.name,
            slot: unit.stay.slot,
            revision_id: revision.id,
            revision_number: revision.number,
            changes,
            before,
            after: target,
          },
        },
        transaction,
      );
    }
  });
}
