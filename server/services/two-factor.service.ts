import crypto from 'node:crypto';
import { generateSecret, generateURI, verify } from 'otplib';
import QRCode from 'qrcode';
import type { Sequelize, Transaction } from 'sequelize';
import { roleAtLeast } from '@shared/schemas/roles';
import type { TwoFactorSetup } from '@shared/schemas/two-factor';
import { verifyPassword } from '../auth/passwords';
import type { SignedInActor } from '../domain/actor';
import { AppError } from '../lib/app-error';
import { Lab, Membership, RecoveryCode, User } from '../models';
import { recordAudit } from './audit.service';

/**
 * Two-step sign-in with a time-based code (TOTP, RFC 6238: 6 digits, 30 s steps, one step of
 * clock drift either way) from an authenticator app, through otplib. Ten single-use recovery
 * codes are shown once and kept only as SHA-256 (they are random, 80 bits each).
 */
const recoveryCodeCount = 10;
const stepSeconds = 30;
// Crockford's base32 alphabet: no I, L, O or U to misread.
const codeAlphabet = '0123456789ABCDEFGHJKMNPQRSTVWXYZ';

const hashCode = (code: string) =>
  crypto
    .createHash('sha256')
    .update(code.toUpperCase().replace(/[^0-9A-Z]/g, ''))
    .digest('hex');

function newRecoveryCode(): string {
  const bytes = crypto.randomBytes(16);
  const chars = [...bytes].map((byte) => codeAlphabet[byte % 32]).join('');
  return `${chars.slice(0, 4)}-${chars.slice(4, 8)}-${chars.slice(8, 12)}-${chars.slice(12, 16)}`;
}

/** A fresh secret for the authenticator app; kept in the session until a code confirms it. */
export async function startTwoFactorSetup(userId: string): Promise<TwoFactorSetup> {
  const user = await User.findByPk(userId);
  if (!user) throw new AppError('not_signed_in', 'Sign in to use this part of Halflight.', 401);
  if (user.totpEnabledAt) throw new AppError('two_factor_on', 'Two-step sign-in is already on.', 409);
  const secret = generateSecret();
  const otpauthUri = generateURI({ issuer: 'Halflight', label: user.email, secret });
  return { secret, otpauthUri, qrCode: await QRCode.toDataURL(otpauthUri, { margin: 1, width: 220 }) };
}

/** Checks a 6-digit code against a secret; returns the time step it matched, or null. */
async function matchCode(secret: string, code: string, afterStep: number | null): Promise<number | null> {
  if (!/^\d{6}$/.test(code)) return null;
  const result = await verify({
    secret,
    token: code,
    epochTolerance: stepSeconds,
    ...(afterStep !== null ? { afterTimeStep: afterStep } : {}),
  });
  // A TOTP result carries the start (epoch seconds) of the step the code matched.
  return result.valid ? Math.floor((result as unknown as { epoch: number }).epoch / stepSeconds) : null;
}

async function replaceRecoveryCodes(userId: string, transaction?: Transaction) {
  const codes = Array.from({ length: recoveryCodeCount }, newRecoveryCode);
  await RecoveryCode.destroy({ where: { userId }, transaction });
  await RecoveryCode.bulkCreate(
    codes.map((code) => ({ userId, codeHash: hashCode(code) })),
    { transaction },
  );
  return codes;
}

/** Turns two-step sign-in on once a code from the app proves the secret; returns the recovery codes. */
export async function confirmTwoFactor(
  sequelize: Sequelize,
  actor: SignedInActor,
  secret: string | undefined,
  code: string,
): Promise<string[]> {
  if (!secret) {
    throw new AppError('no_setup', 'Start the set-up again: no new secret is waiting for a code.', 409);
  }
  const step = await matchCode(secret, code, null);
  if (step === null) {
    throw new AppError(
      'wrong_code',
      'That code does not match. Check the time on your phone and try the next code.',
      400,
      [{ path: 'body.code', message: 'does not match' }],
    );
  }
  return sequelize.transaction(async (transaction) => {
    const user = await User.findByPk(actor.userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user) throw new AppError('not_signed_in', 'Sign in to use this part of Halflight.', 401);
    if (user.totpEnabledAt) throw new AppError('two_factor_on', 'Two-step sign-in is already on.', 409);
    await user.update({ totpSecret: secret, totpEnabledAt: new Date(), totpLastStep: step }, { transaction });
    const codes = await replaceRecoveryCodes(user.id, transaction);
    await recordAudit(actor, { action: 'two_factor_enabled', targetType: 'user', targetId: user.id }, transaction);
    return codes;
  });
}

/**
 * The second step of a sign-in: a current code from the app, or one unused recovery code
 * (which is then spent). True when it matched.
 */
export async function checkSecondStep(
  sequelize: Sequelize,
  userId: string,
  input: { code?: string; recoveryCode?: string },
): Promise<'code' | 'recovery-code' | null> {
  return sequelize.transaction(async (transaction) => {
    const user = await User.findByPk(userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user?.totpSecret) return null;
    if (input.code) {
      const step = await matchCode(user.totpSecret, input.code.trim(), user.totpLastStep ?? null);
      if (step === null) return null;
      await user.update({ totpLastStep: step }, { transaction });
      return 'code';
    }
    if (input.recoveryCode) {
      const [spent] = await RecoveryCode.update(
        { usedAt: new Date() },
        { where: { userId, codeHash: hashCode(input.recoveryCode), usedAt: null }, transaction },
      );
      return spent ? 'recovery-code' : null;
    }
    return null;
  });
}

async function assertPassword(userId: string, password: string): Promise<User> {
  const user = await User.findByPk(userId);
  if (!user || !(await verifyPassword(password, user.passwordHash))) {
    throw new AppError('wrong_password', 'The password is not right.', 400, [
      { path: 'body.password', message: 'is not right' },
    ]);
  }
  return user;
}

/** Labs that require a second step of this person in their role there (admins and reviewers). */
export async function labsRequiringTwoFactor(userId: string): Promise<string[]> {
  const memberships = await Membership.findAll({
    where: { userId },
    include: [{ model: Lab, as: 'lab', where: { requireTwoFactor: true } }],
  });
  return memberships
    .filter((membership) => roleAtLeast(membership.role, 'reviewer'))
    .map((membership) => membership.lab!.name);
}

/** Turns two-step sign-in off (password needed), unless a lab requires it of this person. */
export async function disableTwoFactor(actor: SignedInActor, password: string): Promise<void> {
  const user = await assertPassword(actor.userId, password);
  const requiring = await labsRequiringTwoFactor(user.id);
  if (requiring.length) {
    throw new AppError(
      'two_factor_required',
      `${requiring.join(', ')} require${requiring.length === 1 ? 's' : ''} two-step sign-in of its admins and reviewers, so it stays on.`,
      409,
    );
  }
  await user.update({ totpSecret: null, totpEnabledAt: null, totpLastStep: null });
  await RecoveryCode.destroy({ where: { userId: user.id } });
  await recordAudit(actor, { action: 'two_factor_disabled', targetType: 'user', targetId: user.id });
}

/** A new set of recovery codes (password needed); the old ones stop working. */
export async function renewRecoveryCodes(sequelize: Sequelize, actor: SignedInActor, password: string) {
  const user = await assertPassword(actor.userId, password);
  if (!user.totpEnabledAt) throw new AppError('two_factor_off', 'Two-step sign-in is off.', 409);
  return sequelize.transaction(async (transaction) => {
    const codes = await replaceRecoveryCodes(user.id, transaction);
    await recordAudit(actor, { action: 'recovery_codes_renewed', targetType: 'user', targetId: user.id }, transaction);
    return codes;
  });
}
