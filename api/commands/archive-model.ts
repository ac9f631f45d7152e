import type { Sequelize } from 'sequelize';
import type { SetupModel, User } from '../models';
import { recordAuditEvent } from '../audit/record-audit-event';

/**
 * Archives or brings back a model. Archiving only hides it from the hangar's default
 * list: nothing is deleted, and its history, reviews and exports answer as before.
 * Asking for the state it already has changes nothing and records nothing.
 */
export async function setModelArchived(
  sequelize: Sequelize,
  model: SetupModel,
  archived: boolean,
  actor: User,
): Promise<SetupModel> {
  if (archived === (model.archivedAt !== null)) return model;
  return sequelize.transaction(async (transaction) => {
    await model.update(
      archived ? { archivedAt: new Date(), archivedBy: actor.id } : { archivedAt: null, archivedBy: null },
      { transaction, silent: true },
    );
    await recordAuditEvent(
      {
        workspaceId: model.workspaceId,
        actor,
        action: archived ? 'model.archived' : 'model.unarchived',
        subjectType: 'model',
        subjectId: model.id,
        details: { name: model.name },
      },
      transaction,
    );
    return model;
  });
}
