import type { Sequelize, Transaction } from 'sequelize';
import { recordAuditEvent } from '../audit/record-audit-event';
import { modelName } from '../model-fields';
import type { Revision, User } from '../models';
import type { LockedModel } from './lock-model';

/** The setup's own `model.name`, when it is one the model record can take. */
export function setupModelName(data: unknown): string | null {
  const name = (data as { model?: { name?: unknown } } | null)?.model?.name;
  if (typeof name !== 'string') return null;
  const trimmed = name.trim();
  return modelName.safeParse(trimmed).success ? trimmed : null;
}

/**
 * When a revision changes the setup's own `model.name`, the model's name follows (and
 * the rename is audited), so the two never drift apart by a save. Only a record that
 * was in step with the text follows it: a name given on purpose (a fork's, or one
 * chosen when the model was made) is not undone by a save, and the model's Settings
 * screen shows the two names side by side until the pilot picks one.
 */
export async function followModelName(
  sequelize: Sequelize,
  locked: LockedModel,
  data: unknown,
  actor: User,
  revision: Revision,
  transaction: Transaction,
): Promise<void> {
  const { model, latest } = locked;
  const name = setupModelName(data);
  if (name === null || model.name === undefined || name === model.name) return;
  if (!latest || latest.modelName?.trim() !== model.name) return;
  await sequelize.query('UPDATE models SET name = $name WHERE id = $id', {
    bind: { name, id: model.id },
    transaction,
  });
  await recordAuditEvent(
    {
      workspaceId: model.workspaceId,
      actor,
      action: 'model.renamed',
      subjectType: 'model',
      subjectId: model.id,
      details: { from: model.name, to: name, number: revision.number },
      createdAt: revision.createdAt,
    },
    transaction,
  );
  if (model.set) model.set({ name }, { raw: true });
  else model.name = name;
}
