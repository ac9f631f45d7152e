import type { Transaction } from 'sequelize';
import { setupSchema, type Receiver as SlotReceiver, type Setup } from '@shared/format/schema';
import { findSlot, reuseCheck, type ReuseCheck } from '@shared/reuse/reuse-check';
import { Unprocessable } from '../errors';
import { Revision, type Receiver, type SetupModel } from '../models';

/** The newest revision of a model, in full (document and findings). */
export function latestRevisionOf(modelId: string, transaction?: Transaction): Promise<Revision | null> {
  return Revision.findOne({ where: { modelId }, order: [['number', 'DESC']], transaction });
}

/** The setup a stored revision holds, with the format's defaults; null when it does not pass the schema. */
export function setupOf(revision: Pick<Revision, 'document'>): Setup | null {
  const parsed = setupSchema.safeParse(revision.document);
  return parsed.success ? parsed.data : null;
}

export interface SlotInRevision {
  model: SetupModel;
  revision: Revision;
  setup: Setup;
  slot: SlotReceiver;
}

/** The receiver slot of a model's latest revision, or a 422 saying why there is none to check against. */
export async function slotOfLatest(
  model: SetupModel,
  slotId: string,
  transaction?: Transaction,
): Promise<SlotInRevision> {
  const revision = await latestRevisionOf(model.id, transaction);
  if (!revision) throw new Unprocessable(`${model.name} has no revision yet.`, { code: 'no-revision' });
  const setup = setupOf(revision);
  if (!setup) {
    throw new Unprocessable(
      `Revision ${revision.number} of ${model.name} does not pass the format's schema, so its receiver slots cannot be read. Fix the setup first.`,
      {
        code: 'setup-not-valid',
        details: {
          revision: { id: revision.id, number: revision.number },
          findings: revision.findings.filter((f) => f.rule === 'schema' || f.rule === 'syntax'),
        },
      },
    );
  }
  const slot = findSlot(setup, slotId);
  if (!slot) {
    const slots = setup.receivers.map((receiver) => receiver.id);
    throw new Unprocessable(
      `Revision ${revision.number} of ${model.name} has no receiver "${slotId}"; its receivers are ${slots.join(', ')}.`,
      {
        code: 'slot-not-found',
        details: { slot: slotId, slots, revision: { id: revision.id, number: revision.number } },
      },
    );
  }
  return { model, revision, setup, slot };
}

export const unitOf = (receiver: Pick<Receiver, 'outputs' | 'storedSettings'>) => ({
  outputs: receiver.outputs,
  stored: receiver.storedSettings ?? null,
});

export interface SlotCheck extends SlotInRevision {
  check: ReuseCheck;
}

/** The reuse check of a unit against a slot of the model's latest revision. */
export async function checkAgainstLatest(
  receiver: Receiver,
  model: SetupModel,
  slotId: string,
  transaction?: Transaction,
): Promise<SlotCheck> {
  const place = await slotOfLatest(model, slotId, transaction);
  return { ...place, check: reuseCheck(unitOf(receiver), place.slot, place.revision.findings, place.setup) };
}
