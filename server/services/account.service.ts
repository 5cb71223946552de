import { Op } from 'sequelize';
import type { Sequelize } from 'sequelize';
import { hashPassword, verifyPassword } from '../auth/passwords';
import { createLinkToken, hashLinkToken } from '../auth/tokens';
import { AppError } from '../lib/app-error';
import type { Mailer } from '../mail/mailer';
import { passwordResetMessage } from '../mail/templates';
import { PasswordReset, User } from '../models';
import { recordAudit } from './audit.service';
import type { Actor } from '../domain/actor';

const resetLifetimeMs = 60 * 60_000;

/**
 * Mails a single-use reset link (one hour) when the address has an account. The caller
 * answers the same way either way, so the answer reveals nothing about who has an account.
 */
export async function requestPasswordReset(
  email: string,
  context: { actor: Actor; mailer: Mailer; publicUrl: string },
): Promise<void> {
  const user = await User.findOne({ where: { email } });
  await recordAudit(context.actor, {
    action: 'password_reset_requested',
    targetType: 'user',
    targetId: user?.id,
    details: { email, known: Boolean(user) },
  });
  if (!user) return;
  const { token, tokenHash } = createLinkToken();
  await PasswordReset.create({ userId: user.id, tokenHash, expiresAt: new Date(Date.now() + resetLifetimeMs) });
  const link = `${context.publicUrl}/reset-password?token=${token}`;
  await context.mailer.send({ to: user.email, ...passwordResetMessage({ name: user.name, link }) });
}

const invalidToken = () =>
  new AppError('token_invalid', 'This reset link has expired or was already used. Ask for a new one.', 400);

export async function completePasswordReset(
  sequelize: Sequelize,
  input: { token: string; password: string },
  actor: Actor,
): Promise<void> {
  const passwordHash = await hashPassword(input.password);
  await sequelize.transaction(async (transaction) => {
    const reset = await PasswordReset.findOne({
      where: { tokenHash: hashLinkToken(input.token), usedAt: null, expiresAt: { [Op.gt]: new Date() } },
      lock: transaction.LOCK.UPDATE,
      transaction,
    });
    if (!reset) throw invalidToken();
    await reset.update({ usedAt: new Date() }, { transaction });
    await User.update({ passwordHash }, { where: { id: reset.userId }, transaction });
    // Any other outstanding link for this person dies with this one.
    await PasswordReset.update({ usedAt: new Date() }, { where: { userId: reset.userId, usedAt: null }, transaction });
    await recordAudit(
      { ...actor, userId: actor.userId ?? reset.userId },
      { action: 'password_reset_completed', targetType: 'user', targetId: reset.userId },
      transaction,
    );
  });
}

export async function changePassword(
  userId: string,
  input: { currentPassword: string; newPassword: string },
  actor: Actor,
): Promise<void> {
  const user = await User.findByPk(userId);
  if (!user || !(await verifyPassword(input.currentPassword, user.passwordHash))) {
    throw new AppError('wrong_password', 'The current password is not right.', 400, [
      { path: 'body.currentPassword', message: 'is not right' },
    ]);
  }
  await user.update({ passwordHash: await hashPassword(input.newPassword) });
  await recordAudit(actor, { action: 'password_changed', targetType: 'user', targetId: userId });
}
