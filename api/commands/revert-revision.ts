import type { Sequelize, Transaction } from 'sequelize';
import { NotFound } from '../errors';
import { Revision, type User } from '../models';
import { inTransaction } from '../db/transaction';
import { appendRevision } from '../revisions/append-revision';
import { requireLatestBase } from '../revisions/check-base';
import { checkSetupText } from '../revisions/check-setup';
import { lockModel } from '../revisions/lock-model';

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
  const target = await Revision.findOne({
    where: { modelId: input.modelId, number: input.number },
    transaction: input.transaction,
  });
  if (!target)
    throw new NotFound(`This model has no revision ${input.number}.`, {
      code: 'revision-not-found',
      details: { number: input.number },
    });
  const setup = checkSetupText(target.yamlText);
  const message = input.message && input.message.length > 0 ? input.message : `Revert to revision ${target.number}`;
  return inTransaction(sequelize, input.transaction, async (transaction) => {
    const locked = await lockModel(sequelize, input.modelId, transaction);
    requireLatestBase(locked.latest, input.base);
    const audit = {
      action: 'revision.reverted' as const,
      details: { reverted_to: target.number, source_revision_id: target.id },
    };
    return appendRevision(
      sequelize,
      locked,
      setup,
      {
        author: input.author,
        message,
        origin: 'revert',
        sourceRevisionId: target.id,
        createdAt: input.createdAt,
        audit,
        followName: true,
      },
      transaction,
    );
  });
}
