import { Op } from 'sequelize';
import type { Sequelize } from 'sequelize';
import type { AcceptInvitationInput, InvitationPreview } from '@shared/schemas/auth';
import type { InviteMemberInput, PendingInvitation } from '@shared/schemas/members';
import { assertStrongPassword } from '../auth/password-policy';
import { hashPassword, verifyPassword } from '../auth/passwords';
import { createLinkToken, hashLinkToken } from '../auth/tokens';
import { AppError } from '../lib/app-error';
import type { JobQueue } from '../jobs/job-queue';
import { mailJobs } from '../mail/mail-jobs';
import type { LabContext } from '../domain/lab-context';
import { Invitation, Lab, Membership, User } from '../models';
import { recordLabAudit } from './audit.service';
import type { Actor, SignedInActor } from '../domain/actor';

const invitationLifetimeMs = 7 * 24 * 60 * 60_000;

export const toPendingInvitation = (invitation: Invitation): PendingInvitation => ({
  id: invitation.id,
  email: invitation.email,
  role: invitation.role,
  invitedBy: invitation.invitedBy?.name ?? '',
  createdAt: invitation.createdAt.toISOString(),
  expiresAt: invitation.expiresAt.toISOString(),
});

/** Conditions of an invitation that can still be used, evaluated now. */
const openInvitation = () => ({ acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } });

/**
 * Stores a single-use invitation (7 days) to join the lab with a role, and queues its e-mail in
 * the same transaction; the worker makes the link (server/mail/mail-jobs.ts).
 */
export async function inviteMember(
  sequelize: Sequelize,
  lab: LabContext,
  input: InviteMemberInput,
  context: { actor: SignedInActor; jobs: JobQueue },
): Promise<PendingInvitation> {
  const existingUser = await User.findOne({ where: { email: input.email } });
  if (existingUser && (await Membership.count({ where: { labId: lab.id, userId: existingUser.id } }))) {
    throw new AppError('already_member', `${input.email} is already a member of this lab.`, 409);
  }
  if (await Invitation.count({ where: { labId: lab.id, email: input.email, ...openInvitation() } })) {
    throw new AppError(
      'already_invited',
      `${input.email} already has an open invitation; revoke it to send a new one.`,
      409,
    );
  }
  const inviter = await User.findByPk(context.actor.userId);
  const invitation = await sequelize.transaction(async (transaction) => {
    const created = await Invitation.create(
      {
        labId: lab.id,
        email: input.email,
        role: input.role,
        // Replaced by the mail job, which makes the token that goes into the link.
        tokenHash: createLinkToken().tokenHash,
        invitedById: context.actor.userId,
        expiresAt: new Date(Date.now() + invitationLifetimeMs),
      },
      { transaction },
    );
    await recordLabAudit({ lab, actor: context.actor, transaction }, 'invitation_sent', ['invitation', created.id], {
      email: input.email,
      role: input.role,
    });
    await context.jobs.send(mailJobs.invitation, { invitationId: created.id }, { transaction });
    return created;
  });
  invitation.invitedBy = inviter ?? undefined;
  return toPendingInvitation(invitation);
}

const invalidInvitation = () =>
  new AppError('invitation_invalid', 'This invitation has expired, was revoked or was already used.', 404);

async function findOpenInvitation(token: string) {
  return Invitation.findOne({
    where: { tokenHash: hashLinkToken(token), ...openInvitation() },
    include: [
      { model: Lab, as: 'lab' },
      { model: User, as: 'invitedBy' },
    ],
  });
}

export async function previewInvitation(token: string): Promise<InvitationPreview> {
  const invitation = await findOpenInvitation(token);
  if (!invitation?.lab) throw invalidInvitation();
  return {
    labName: invitation.lab.name,
    role: invitation.role,
    email: invitation.email,
    invitedBy: invitation.invitedBy?.name ?? '',
    expiresAt: invitation.expiresAt.toISOString(),
    accountExists: (await User.count({ where: { email: invitation.email } })) > 0,
  };
}

/**
 * Accepts an invitation: a new person gets an account with their name and password; a person
 * with an account proves it with their password. Returns the user id to sign in.
 */
export async function acceptInvitation(
  sequelize: Sequelize,
  token: string,
  input: AcceptInvitationInput,
  ip: string | null,
): Promise<string> {
  const newName = 'name' in input ? input.name : null;
  if (newName) assertStrongPassword(input.password, 'body.password', [newName]);
  const newPasswordHash = newName ? await hashPassword(input.password) : null;
  return sequelize.transaction(async (transaction) => {
    const invitation = await Invitation.findOne({
      where: { tokenHash: hashLinkToken(token), ...openInvitation() },
      lock: transaction.LOCK.UPDATE,
      transaction,
    });
    if (!invitation) throw invalidInvitation();
    let user = await User.findOne({ where: { email: invitation.email }, transaction });
    if (user) {
      if (!(await verifyPassword(input.password, user.passwordHash))) {
        throw new AppError('invalid_credentials', 'That password does not match the account for this address.', 401);
      }
    } else {
      if (!newName || !newPasswordHash) {
        throw new AppError('validation_failed', 'A name is needed to create your account.', 400, [
          { path: 'body.name', message: 'is required' },
        ]);
      }
      user = await User.create(
        { email: invitation.email, name: newName, passwordHash: newPasswordHash },
        { transaction },
      );
    }
    await invitation.update({ acceptedAt: new Date() }, { transaction });
    const membership = await Membership.create(
      { labId: invitation.labId, userId: user.id, role: invitation.role },
      { transaction },
    );
    await recordLabAudit(
      { lab: { id: invitation.labId }, actor: { userId: user.id, ip }, transaction },
      'membership_added',
      ['membership', membership.id],
      { role: invitation.role, via: 'invitation', invitationId: invitation.id },
    );
    return user.id;
  });
}

export async function revokeInvitation(lab: LabContext, invitationId: string, actor: Actor): Promise<void> {
  const invitation = await Invitation.findOne({
    where: { id: invitationId, labId: lab.id, acceptedAt: null, revokedAt: null },
  });
  if (!invitation) throw new AppError('not_found', 'No open invitation with this id in this lab.', 404);
  await Invitation.sequelize!.transaction(async (transaction) => {
    await invitation.update({ revokedAt: new Date() }, { transaction });
    await recordLabAudit({ lab, actor, transaction }, 'invitation_revoked', ['invitation', invitation.id], {
      email: invitation.email,
    });
  });
}
