import type { Sequelize } from 'sequelize';
import { assertStrongPassword } from '../auth/password-policy';
import { hashPassword } from '../auth/passwords';
import { Lab, Membership, User } from '../models';
import { recordLabAudit } from './audit.service';

export function slugify(name: string): string {
  const base = name
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '')
    .slice(0, 60);
  return base || 'lab';
}

/**
 * On a real deployment: creates the first lab and its admin from HALFLIGHT_FIRST_ADMIN_EMAIL /
 * _PASSWORD / HALFLIGHT_FIRST_LAB_NAME, once. Does nothing when that address already has an account.
 */
export async function ensureFirstAdmin(
  sequelize: Sequelize,
  input: { email: string; password: string; labName: string },
): Promise<{ created: boolean }> {
  const email = input.email.trim().toLowerCase();
  if (await User.count({ where: { email } })) return { created: false };
  assertStrongPassword(input.password, 'HALFLIGHT_FIRST_ADMIN_PASSWORD', [email]);
  const passwordHash = await hashPassword(input.password);
  await sequelize.transaction(async (transaction) => {
    const lab = await Lab.create(
      { name: input.labName, slug: `${slugify(input.labName)}-${Date.now().toString(36)}` },
      { transaction },
    );
    const name = email.split('@')[0] ?? email;
    const user = await User.create({ email, name, passwordHash }, { transaction });
    const membership = await Membership.create({ labId: lab.id, userId: user.id, role: 'admin' }, { transaction });
    await recordLabAudit(
      { lab, actor: { userId: null, ip: null }, transaction },
      'membership_added',
      ['membership', membership.id],
      { role: 'admin', via: 'first-admin setting' },
    );
  });
  return { created: true };
}
