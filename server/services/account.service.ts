import { Op } from 'sequelize';
import type { Sequelize } from 'sequelize';
import { assertStrongPassword } from '../auth/password-policy';
import { hashPassword, verifyPassword } from '../auth/passwords';
import { endSessionsOf } from '../auth/session-records';
import { hashLinkToken } from '../auth/tokens';
import { AppError } from '../lib/app-error';
import type { JobQueue } from '../jobs/job-queue';
import { mailJobs } from '../mail/mail-jobs';
import type { ResetRequestJob } from '../mail/mail-jobs';
import { PasswordReset, User } from '../models';
import { recordAudit } from './audit.service';
import type { Actor } from '../domain/actor';

/**
 * Queues the request and returns: whether the address has an account is looked up later by the
 * job (server/mail/mail-jobs.ts), so known and unknown addresses take the same path and the
 * same time here, and a slow or absent mail relay never delays the answer.
 */
export async function requestPasswordReset(email: string, context: { actor: Actor; jobs: JobQueue }): Promise<void> {
  await context.jobs.send<ResetRequestJob>(mailJobs.resetRequest, { email, ip: context.actor.ip });
}

const invalidToken = () =>
  new AppError('token_invalid', 'This reset link has expired or was already used. Ask for a new one.', 400);

export async function completePasswordReset(
  sequelize: Sequelize,
  input: { token: string; password: string },
  actor: Actor,
): Promise<void> {
  assertStrongPassword(input.password, 'body.password');
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
    // Any other outstanding link for this person dies with this one, and so does every session.
    await PasswordReset.update({ usedAt: new Date() }, { where: { userId: reset.userId, usedAt: null }, transaction });
    await endSessionsOf(sequelize, reset.userId, { transaction });
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
  assertStrongPassword(input.newPassword, 'body.newPassword', [user.email, user.name]);
  const passwordHash = await hashPassword(input.newPassword);
  await User.sequelize!.transaction(async (transaction) => {
    await user.update({ passwordHash }, { transaction });
    await recordAudit(actor, { action: 'password_changed', targetType: 'user', targetId: userId }, transaction);
  });
}
