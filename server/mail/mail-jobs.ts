import { Op } from 'sequelize';
import type { Sequelize } from 'sequelize';
import type { Logger } from 'pino';
import { createLinkToken } from '../auth/tokens';
import type { JobQueue } from '../jobs/job-queue';
import { Invitation, Lab, PasswordReset, User } from '../models';
import { recordAudit } from '../services/audit.service';
import type { Mailer, OutgoingMessage } from './mailer';
import { invitationMessage, passwordResetMessage } from './templates';

/**
 * Every e-mail Halflight sends goes through the job queue: the request only stores a job (in the
 * transaction of the change it belongs to) and answers; a worker sends it, with retries while
 * the relay is down. Jobs carry record ids, never link tokens: the worker makes a fresh token
 * for each attempt, so no usable link is ever stored in the database.
 */
export const mailJobs = {
  message: 'mail-message',
  resetRequest: 'password-reset-request',
  resetLink: 'mail-password-reset',
  invitation: 'mail-invitation',
} as const;

export interface ResetRequestJob {
  email: string;
  ip: string | null;
}

export const resetLinkLifetimeMs = 60 * 60_000;
// A reset asked for long ago (the relay was down for a day) is not worth sending any more.
const resetGiveUpMs = 24 * 60 * 60_000;

export function registerMailJobs(
  queue: JobQueue,
  context: { sequelize: Sequelize; mailer: Mailer; publicUrl: string; logger: Logger },
): void {
  const { sequelize, mailer, publicUrl, logger } = context;
  const send = async (message: OutgoingMessage) => {
    await mailer.send(message);
    logger.info({ mail: { kind: message.kind, to: message.to } }, 'mail sent');
  };

  queue.handle<OutgoingMessage>(mailJobs.message, send);

  // The request answered at once and the same way for every address; here we learn whether the
  // address has an account, and if so store a reset and queue its e-mail, both or neither.
  queue.handle<ResetRequestJob>(mailJobs.resetRequest, async ({ email, ip }) => {
    await sequelize.transaction(async (transaction) => {
      const user = await User.findOne({ where: { email }, transaction });
      await recordAudit(
        { userId: null, ip },
        {
          action: 'password_reset_requested',
          targetType: 'user',
          targetId: user?.id,
          details: { email, known: Boolean(user) },
        },
        transaction,
      );
      if (!user) return;
      const reset = await PasswordReset.create(
        {
          userId: user.id,
          tokenHash: createLinkToken().tokenHash,
          expiresAt: new Date(Date.now() + resetLinkLifetimeMs),
        },
        { transaction },
      );
      await queue.send(mailJobs.resetLink, { resetId: reset.id }, { transaction });
    });
  });

  queue.handle<{ resetId: string }>(mailJobs.resetLink, async ({ resetId }) => {
    const reset = await PasswordReset.findOne({
      where: { id: resetId, usedAt: null, createdAt: { [Op.gt]: new Date(Date.now() - resetGiveUpMs) } },
      include: [{ model: User, as: 'user' }],
    });
    if (!reset?.user) return;
    // A fresh token per attempt; the link works for an hour from when it is mailed.
    const { token, tokenHash } = createLinkToken();
    await reset.update({ tokenHash, expiresAt: new Date(Date.now() + resetLinkLifetimeMs) });
    const link = `${publicUrl}/reset-password?token=${token}`;
    await send({
      to: reset.user.email,
      kind: 'password-reset',
      ...passwordResetMessage({ name: reset.user.name, link }),
    });
  });

  queue.handle<{ invitationId: string }>(mailJobs.invitation, async ({ invitationId }) => {
    const invitation = await Invitation.findOne({
      where: { id: invitationId, acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } },
      include: [
        { model: Lab, as: 'lab' },
        { model: User, as: 'invitedBy' },
      ],
    });
    if (!invitation?.lab) return;
    const { token, tokenHash } = createLinkToken();
    await invitation.update({ tokenHash });
    await send({
      to: invitation.email,
      kind: 'invitation',
      labId: invitation.labId,
      senderId: invitation.invitedById,
      ...invitationMessage({
        labName: invitation.lab.name,
        inviterName: invitation.invitedBy?.name ?? 'A lab admin',
        role: invitation.role,
        link: `${publicUrl}/invitations/${token}`,
        expiresAt: invitation.expiresAt,
      }),
    });
  });
}
