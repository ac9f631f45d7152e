import { Op, type Transaction } from 'sequelize';
import { findSlot, reuseCheck } from '@shared/reuse/reuse-check';
import { Receiver, ReceiverInstall, Revision, SetupModel } from '../models';
import { presentReceiver, type PresentedReceiver, type Readiness } from '../presenters/receiver';
import { setupOf, unitOf } from './receiver-slot';

/** The open install of each receiver, with its model, by receiver id. */
export async function openInstalls(
  receiverIds: readonly string[],
  transaction?: Transaction,
): Promise<Map<string, ReceiverInstall>> {
  if (receiverIds.length === 0) return new Map();
  const installs = await ReceiverInstall.findAll({
    where: { receiverId: { [Op.in]: [...receiverIds] }, removedAt: null },
    include: [{ model: SetupModel, as: 'model', attributes: ['id', 'name', 'workspaceId'] }],
    transaction,
  });
  return new Map(installs.map((install) => [install.receiverId, install]));
}

async function latestFullRevisions(
  modelIds: readonly string[],
  transaction?: Transaction,
): Promise<Map<string, Revision>> {
  if (modelIds.length === 0) return new Map();
  const rows = await Revision.findAll({
    attributes: ['modelId', [Revision.sequelize!.fn('max', Revision.sequelize!.col('number')), 'number']],
    where: { modelId: { [Op.in]: [...modelIds] } },
    group: ['modelId'],
    raw: true,
    transaction,
  });
  if (rows.length === 0) return new Map();
  const revisions = await Revision.findAll({
    where: { [Op.or]: rows.map((row) => ({ modelId: row.modelId, number: row.number })) },
    attributes: ['id', 'modelId', 'number', 'document', 'findings'],
    transaction,
  });
  return new Map(revisions.map((revision) => [revision.modelId, revision]));
}

function readinessOf(receiver: Receiver, install: ReceiverInstall, revision: Revision | undefined): Readiness {
  if (!revision) return { state: 'unchecked', changes: 0, revision: null, reason: 'The model has no revision yet.' };
  const ref = { id: revision.id, number: revision.number };
  const setup = setupOf(revision);
  if (!setup)
    return {
      state: 'unchecked',
      changes: 0,
      revision: ref,
      reason: `Revision ${revision.number} does not pass the format's schema.`,
    };
  const slot = findSlot(setup, install.slot);
  if (!slot)
    return {
      state: 'unchecked',
      changes: 0,
      revision: ref,
      reason: `Revision ${revision.number} has no receiver "${install.slot}".`,
    };
  const check = reuseCheck(unitOf(receiver), slot, [], setup);
  const state = check.notes.some((note) => note.blocking) ? 'blocked' : check.ready ? 'ready' : 'changes';
  return { state, changes: check.changes.length, revision: ref, reason: null };
}

/** Receivers as the shelf shows them: where each is, and whether it is ready for that slot now. */
export async function presentShelf(
  receivers: readonly Receiver[],
  transaction?: Transaction,
): Promise<PresentedReceiver[]> {
  const installs = await openInstalls(
    receivers.map((receiver) => receiver.id),
    transaction,
  );
  const revisions = await latestFullRevisions(
    [...new Set([...installs.values()].map((install) => install.modelId))],
    transaction,
  );
  return receivers.map((receiver) => {
    const install = installs.get(receiver.id) ?? null;
    return presentReceiver(receiver, {
      install,
      readiness: install ? readinessOf(receiver, install, revisions.get(install.modelId)) : null,
    });
  });
}

export async function presentOnShelf(receiver: Receiver, transaction?: Transaction): Promise<PresentedReceiver> {
  const [presented] = await presentShelf([receiver], transaction);
  return presented;
}
