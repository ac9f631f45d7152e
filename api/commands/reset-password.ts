import { randomUUID } from 'node:crypto';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { linkExpired, linkUsed, signLinkToken } from '../auth/link-tokens';
import { hashPassword } from '../auth/passwords';
import type { AppConfig } from '../config';
import { NotFound } from '../errors';
import { appLink } from '../mail/context';
import { queuedRow, type MailService } from '../mail/mail-service';
import { passwordResetMail } from '../mail/messages';
import { PasswordReset, User } from '../models';

export const PASSWORD_RESET_TTL_MS = 60 * 60 * 1000;

/**
 * Queues a reset link when an account has this address; says nothing either way, and
 * takes the same path either way so the answer's timing does not tell: one lookup, the
 * link signed and the mail composed, then one statement that writes the reset and its
 * queued mail only when the account exists. No SMTP happens in the request.
 */
export async function requestPasswordReset(
  sequelize: Sequelize,
  config: AppConfig,
  mail: MailService,
  email: string,
): Promise<void> {
  const account = await User.findOne({ where: { email }, attributes: ['name'] });
  const resetId = randomUUID();
  const expiresAt = new Date(Date.now() + PASSWORD_RESET_TTL_MS);
  const token = signLinkToken('password-reset', resetId, expiresAt, config);
  const row = queuedRow(
    passwordResetMail({
      to: email,
      name: account?.name ?? 'pilot',
      url: appLink(mail, `/reset-password/${token}`),
      expiresAt,
    }),
    mail.from,
  );
  await sequelize.query(
    `WITH account AS (SELECT id FROM users WHERE email = $email),
          reset AS (INSERT INTO password_resets (id, user_id, expires_at)
                    SELECT $resetId, id, $expiresAt FROM account RETURNING id)
     INSERT INTO outbox (message_id, envelope_from, envelope_to, from_header, to_header, subject,
                         text_body, html_body, size_bytes, state, next_attempt_at)
     SELECT $messageId, $envelopeFrom, $envelopeTo, $fromHeader, $toHeader, $subject,
            $textBody, $htmlBody, $sizeBytes, 'pending', now()
       FROM reset`,
    { bind: { email, resetId, expiresAt, ...row }, type: QueryTypes.INSERT },
  );
  mail.deliverSoon();
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
    await closeOpenResets(user.id, transaction);
    return user.reload({ transaction });
  });
}

/** Uses up every open reset link of an account: a new password makes the older links moot. */
export async function closeOpenResets(userId: string, transaction: Transaction): Promise<void> {
  await PasswordReset.update({ usedAt: new Date() }, { where: { userId, usedAt: null }, transaction });
}
