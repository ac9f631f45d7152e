import type { Sequelize } from 'sequelize';
import { linkExpired, linkUsed, signLinkToken } from '../auth/link-tokens';
import { hashPassword } from '../auth/passwords';
import type { AppConfig } from '../config';
import { NotFound } from '../errors';
import { appLink } from '../mail/context';
import type { MailService } from '../mail/mail-service';
import { passwordResetMail } from '../mail/messages';
import { PasswordReset, User } from '../models';

export const PASSWORD_RESET_TTL_MS = 60 * 60 * 1000;

/** Mails a reset link when an account has this address; says nothing either way. */
export async function requestPasswordReset(
  sequelize: Sequelize,
  config: AppConfig,
  mail: MailService,
  email: string,
): Promise<void> {
  const user = await User.findOne({ where: { email } });
  if (!user) return;
  await sequelize.transaction(async (transaction) => {
    const reset = await PasswordReset.create(
      { userId: user.id, expiresAt: new Date(Date.now() + PASSWORD_RESET_TTL_MS) },
      { transaction },
    );
    const token = signLinkToken('password-reset', reset.id, reset.expiresAt, config);
    await mail.send(
      passwordResetMail({
        to: user.email,
        name: user.name,
        url: appLink(mail, `/reset-password/${token}`),
        expiresAt: reset.expiresAt,
      }),
    );
  });
}

const resetNotFound = () => new NotFound('This password reset no longer exists.', { code: 'reset-not-found' });

function usable(reset: PasswordReset | null): PasswordReset & { user: User } {
  if (!reset?.user) throw resetNotFound();
  if (reset.usedAt) throw linkUsed('password-reset');
  if (reset.expiresAt.getTime() <= Date.now()) throw linkExpired('password-reset');
  return reset as PasswordReset & { user: User };
}

/** The account a reset link is for, while the link still works. */
export async function openPasswordReset(id: string): Promise<User> {
  return usable(await PasswordReset.findByPk(id, { include: [{ model: User, as: 'user', required: true }] })).user;
}

/**
 * Sets the new password, uses up every open reset link of the account, and raises its
 * session version so every session signed in before (the one that may have leaked
 * included) ends.
 */
export async function resetPassword(sequelize: Sequelize, id: string, password: string): Promise<User> {
  const passwordHash = await hashPassword(password);
  return sequelize.transaction(async (transaction) => {
    const reset = usable(
      await PasswordReset.findByPk(id, {
        include: [{ model: User, as: 'user', required: true }],
        lock: { level: transaction.LOCK.UPDATE, of: PasswordReset },
        transaction,
      }),
    );
    const user = reset.user;
    await user.update({ passwordHash }, { transaction });
    await user.increment('sessionVersion', { transaction });
    await PasswordReset.update({ usedAt: new Date() }, { where: { userId: user.id, usedAt: null }, transaction });
    return user.reload({ transaction });
  });
}
