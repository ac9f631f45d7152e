import type { Sequelize, Transaction } from 'sequelize';
import { inTransaction } from '../db/transaction';
import { ChecklistTick, type Review, type User } from '../models';

/** Ticks and unticks checklist items of a review in the caller's transaction. */
export async function setTicks(
  review: Review,
  user: User,
  changes: Record<string, boolean>,
  transaction: Transaction,
): Promise<void> {
  for (const [item, ticked] of Object.entries(changes)) {
    if (ticked) {
      await ChecklistTick.findOrCreate({
        where: { reviewId: review.id, item },
        defaults: { reviewId: review.id, item, tickedBy: user.id },
        transaction,
      });
    } else {
      await ChecklistTick.destroy({ where: { reviewId: review.id, item }, transaction });
    }
  }
}

/** A reviewer ticks or unticks pre-maiden checklist items, all of them or none. */
export function tickChecklist(
  sequelize: Sequelize,
  input: { review: Review; user: User; changes: Record<string, boolean>; transaction?: Transaction },
): Promise<void> {
  return inTransaction(sequelize, input.transaction, (transaction) =>
    setTicks(input.review, input.user, input.changes, transaction),
  );
}
