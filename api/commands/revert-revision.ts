import type { Sequelize, Transaction } from 'sequelize';
import { NotFound } from '../errors';
import { Revision, type User } from '../models';
import { recordAuditEvent } from './record-audit-event';
import { appendRevision, checkSetupText, inTransaction, lockModel, requireLatestBase } from './save-revision';

export interface RevertInput {
  modelId: string;
  author: User;
  /** The revision whose content comes back. */
  number: number;
  base: number;
  message?: string;
  createdAt?: Date;
  transaction?: Transaction;
}

/**
 * A new revision on top of the latest whose text is exactly revision `number`'s.
 * Nothing is removed: the reverted revisions stay in the history. The findings are
 * checked again, so they reflect today's checks.
 */
export async function revertRevision(sequelize: Sequelize, input: RevertInput): Promise<Revision> {
  const target = await Revision.findOne({ where: { modelId: input.modelId, number: input.number }, transaction: input.transaction });
  if (!target) throw new NotFound(`This model has no revision ${input.number}.`, { code: 'revision-not-found', details: { number: input.number } });
  const setup = checkSetupText(target.yamlText);
  const message = input.message && input.message.length > 0 ? input.message : `Revert to revision ${target.number}`;
  return inTransaction(sequelize, input.transaction, async (transaction) => {
    const locked = await lockModel(input.modelId, transaction);
    requireLatestBase(locked.latest, input.base);
    const revision = await appendRevision(locked, setup, { author: input.author, message, origin: 'revert', sourceRevisionId: target.id, createdAt: input.createdAt }, transaction);
    await recordAuditEvent(
      {
        workspaceId: locked.model.workspaceId,
        actor: input.author,
        action: 'revision.reverted',
        subjectType: 'revision',
        subjectId: revision.id,
        details: { model_id: locked.model.id, number: revision.number, reverted_to: target.number, source_revision_id: target.id },
        createdAt: input.createdAt,
      },
      transaction,
    );
    return revision;
  });
}
