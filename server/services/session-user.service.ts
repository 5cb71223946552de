import type { SessionUser } from '@shared/schemas/auth';
import { AppError } from '../lib/app-error';
import { Lab, Membership, User } from '../models';

/** The signed-in person with every lab they belong to and their role there. */
export async function loadSessionUser(userId: string): Promise<SessionUser> {
  const user = await User.findByPk(userId);
  if (!user) throw new AppError('not_signed_in', 'Sign in to use this part of Halflight.', 401);
  const memberships = await Membership.findAll({
    where: { userId },
    include: [{ model: Lab, as: 'lab' }],
    order: [[{ model: Lab, as: 'lab' }, 'name', 'ASC']],
  });
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    labs: memberships.map((membership) => ({
      labId: membership.lab!.id,
      labName: membership.lab!.name,
      isDemo: membership.lab!.isDemo,
      role: membership.role,
      requireTwoFactor: membership.lab!.requireTwoFactor,
    })),
  };
}
