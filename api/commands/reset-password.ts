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
 * Queues a reset request, saying nothing about whether an account has the address, and
 * does the same work either way so the answer's timing does not tell: one lookup (for
 * the greeting), the link signed and the mail composed, one row inserted. The delivery
 * loop, after the answer, turns the row into a reset and its mail only when an account
 * has the address (api/mail/reset-requests.ts). No SMTP happens in the request.
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
    `INSERT INTO password_reset_requests (id, email, expires_at, mail) VALUES ($resetId, $email, $expiresAt, $mail)`,
    { bind: { resetId, email, expiresAt, mail: JSON.stringify(outboxColumns(row)) }, type: QueryTypes.INSERT },
  );
  mail.deliverSoon();
}

/** A queued row's fields under the outbox table's column names. */
function outboxColumns(row: ReturnType<typeof queuedRow>) {
  return {
    message_id: row.messageId,
    envelope_from: row.envelopeFrom,
    envelope_to: row.envelopeTo,
    from_header: row.fromHeader,
    to_header: row.toHeader,
    subject: row.subject,
    text_body: row.textBody,
    html_body: row.htmlBody,
    size_bytes: row.sizeBytes,
  };
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

/**
 * Uses up every open reset link of an account, and drops its requests still waiting to
 * become one: a new password makes the older links moot.
 */
export async function closeOpenResets(userId: string, transaction: Transaction): Promise<void> {
  await PasswordReset.update({ usedAt: new Date() }, { where: { userId, usedAt: null }, transaction });
  await PasswordReset.sequelize!.query(
    'DELETE FROM password_reset_requests WHERE email = (SELECT email FROM users WHERE id = $userId)',
    { bind: { userId }, transaction },
  );
}
