import { Op } from 'sequelize';
import type { Sequelize, Transaction } from 'sequelize';
import type { Member, MembersList } from '@shared/schemas/members';
import type { Role } from '@shared/schemas/roles';
import { AppError } from '../lib/app-error';
import type { LabContext } from '../domain/lab-context';
import { Invitation, Membership, User } from '../models';
import { recordLabAudit } from './audit.service';
import type { Actor } from '../domain/actor';
import { toPendingInvitation } from './invitations.service';

const toMember = (membership: Membership): Member => ({
  id: membership.id,
  userId: membership.userId,
  name: membership.user?.name ?? '',
  email: membership.user?.email ?? '',
  role: membership.role,
  joinedAt: membership.createdAt.toISOString(),
});

/** Members of the lab; open invitations only for admins, who manage them. */
export async function listMembers(lab: LabContext): Promise<MembersList> {
  const memberships = await Membership.findAll({
    where: { labId: lab.id },
    include: [{ model: User, as: 'user' }],
    order: [[{ model: User, as: 'user' }, 'name', 'ASC']],
  });
  const invitations =
    lab.role === 'admin'
      ? await Invitation.findAll({
          where: { labId: lab.id, acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } },
          include: [{ model: User, as: 'invitedBy' }],
          order: [['createdAt', 'DESC']],
        })
      : [];
  return { members: memberships.map(toMember), invitations: invitations.map(toPendingInvitation) };
}

/** Locks the lab's admin rows, then refuses a change that would leave the lab without an admin. */
async function loadForChange(labId: string, memberId: string, transaction: Transaction) {
  const admins = await Membership.findAll({
    where: { labId, role: 'admin' },
    lock: transaction.LOCK.UPDATE,
    transaction,
  });
  const membership = await Membership.findOne({
    where: { id: memberId, labId },
    include: [{ model: User, as: 'user' }],
    lock: { level: transaction.LOCK.UPDATE, of: Membership },
    transaction,
  });
  if (!membership) throw new AppError('not_found', 'No member with this id in this lab.', 404);
  const isLastAdmin = membership.role === 'admin' && admins.length <= 1;
  return { membership, isLastAdmin };
}

const lastAdmin = (what: string) =>
  new AppError('last_admin', `The lab needs at least one admin, so its last admin cannot be ${what}.`, 409);

export async function changeMemberRole(
  sequelize: Sequelize,
  lab: LabContext,
  memberId: string,
  role: Role,
  actor: Actor,
): Promise<Member> {
  return sequelize.transaction(async (transaction) => {
    const { membership, isLastAdmin } = await loadForChange(lab.id, memberId, transaction);
    if (isLastAdmin && role !== 'admin') throw lastAdmin('demoted');
    const previous = membership.role;
    await membership.update({ role }, { transaction });
    await recordLabAudit({ lab, actor, transaction }, 'role_changed', ['membership', membership.id], {
      userId: membership.userId,
      from: previous,
      to: role,
    });
    return toMember(membership);
  });
}

export async function removeMember(sequelize: Sequelize, lab: LabContext, memberId: string, actor: Actor) {
  await sequelize.transaction(async (transaction) => {
    const { membership, isLastAdmin } = await loadForChange(lab.id, memberId, transaction);
    if (isLastAdmin) throw lastAdmin('removed');
    await membership.destroy({ transaction });
    await recordLabAudit({ lab, actor, transaction }, 'member_removed', ['membership', membership.id], {
      userId: membership.userId,
      role: membership.role,
      email: membership.user?.email,
    });
  });
}
