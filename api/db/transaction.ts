import type { Sequelize, Transaction } from 'sequelize';

/**
 * Runs `work` in the caller's transaction when there is one (a command called by
 * another command, or the demo seed writing a whole history in one), otherwise in a
 * transaction of its own. Commands open transactions through this; routes never do.
 */
export function inTransaction<T>(
  sequelize: Sequelize,
  outer: Transaction | undefined,
  work: (transaction: Transaction) => Promise<T>,
): Promise<T> {
  return outer ? work(outer) : sequelize.transaction(work);
}
