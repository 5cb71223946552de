import { Op } from 'sequelize';
import type { CaughtMailList } from '@shared/schemas/members';
import { CaughtMail, User } from '../models';

/**
 * Caught mail one signed-in person may read: messages addressed to them, and the invitations
 * they sent themselves. Nobody reads another person's reset link, whatever their role.
 */
export async function listCaughtMail(userId: string, page: number, pageSize: number): Promise<CaughtMailList> {
  const user = await User.findByPk(userId, { attributes: ['email'] });
  if (!user) return { total: 0, items: [] };
  const { rows, count } = await CaughtMail.findAndCountAll({
    where: {
      [Op.or]: [{ toAddresses: { [Op.contains]: [user.email] } }, { kind: 'invitation', senderId: userId }],
    },
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
