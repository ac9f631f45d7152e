import type { Sequelize } from 'sequelize';
import { hashPassword, verifyPassword } from '../auth/passwords';
import { Forbidden } from '../errors';
import { User } from '../models';
import { closeOpenResets } from './reset-password';

/**
 * Sets a new password after the current one is given again, and raises the session
 * version so every session of the account ends, the one that may have leaked
 * included; the caller re-issues a session for the device that asked. Reset links
 * mailed before stop working too: one may sit in a mailbox someone else can read.
 */
export async function changePassword(
  sequelize: Sequelize,
  user: User,
  input: { current: string; password: string },
): Promise<User> {
  if (!(await verifyPassword(input.current, user.passwordHash))) {
    throw new Forbidden('The current password is not right, so the password was not changed.', {
      code: 'wrong-password',
      details: { fields: { current: 'This is not your current password.' } },
    });
  }
  const passwordHash = await hashPassword(input.password);
  return sequelize.transaction(async (transaction) => {
    const locked = await User.findByPk(user.id, { lock: transaction.LOCK.UPDATE, transaction, rejectOnEmpty: true });
    await locked.update({ passwordHash }, { transaction });
    await locked.increment('sessionVersion', { transaction });
    await closeOpenResets(locked.id, transaction);
    return locked.reload({ transaction });
  });
}
