import { Op } from 'sequelize';
import type { CaughtMailList } from '@shared/schemas/members';
import type { LabContext } from '../domain/lab-context';
import { CaughtMail, Membership, User } from '../models';

/**
 * Mail the local catcher took that concerns this lab: messages tagged with the lab, and
 * messages to its members' addresses (password resets carry no lab).
 */
export async function listCaughtMail(lab: LabContext, page: number, pageSize: number): Promise<CaughtMailList> {
  const members = await Membership.findAll({
    where: { labId: lab.id },
    include: [{ model: User, as: 'user', attributes: ['email'] }],
  });
  const emails = members.map((membership) => membership.user?.email).filter((email): email is string => !!email);
  const { rows, count } = await CaughtMail.findAndCountAll({
    where: { [Op.or]: [{ labId: lab.id }, { toAddresses: { [Op.overlap]: emails } }] },
    order: [['receivedAt', 'DESC']],
    limit: pageSize,
    offset: (page - 1) * pageSize,
  });
  return {
    total: count,
    items: rows.map((mail) => ({
      id: mail.id,
      from: mail.fromAddress,
      to: mail.toAddresses,
      subject: mail.subject,
      text: mail.textBody,
      html: mail.htmlBody,
      receivedAt: mail.receivedAt.toISOString(),
    })),
  };
}
