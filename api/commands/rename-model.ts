import type { Sequelize } from 'sequelize';
import type { SetupModel, User } from '../models';
import { recordAuditEvent } from '../audit/record-audit-event';

/** Renames the model record; the setup's own `model.name` lives in its revisions and is left alone. */
export async function renameModel(
  sequelize: Sequelize,
  model: SetupModel,
  name: string,
  actor: User,
): Promise<SetupModel> {
  if (model.name === name) return model;
  const previous = model.name;
  return sequelize.transaction(async (transaction) => {
    await model.update({ name }, { transaction });
    await recordAuditEvent(
      {
        workspaceId: model.workspaceId,
        actor,
        action: 'model.renamed',
        subjectType: 'model',
        subjectId: model.id,
        details: { from: previous, to: name },
      },
      transaction,
    );
    return model;
  });
}
