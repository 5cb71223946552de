import type { Transaction } from 'sequelize';
import { roleAtLeast } from '@shared/schemas/roles';
import { AppError } from '../../lib/app-error';
import type { LabContext } from '../../domain/lab-context';
import { Compound, Lab } from '../../models';
import type { Actor } from '../../domain/actor';

/** The compound with this id in this lab, or 404 (another lab's id looks exactly like an unknown one). */
export async function findCompound(lab: LabContext, compoundId: string, transaction?: Transaction, lock = false) {
  const compound = await Compound.findOne({
    where: { id: compoundId, labId: lab.id },
    transaction,
    lock: lock && transaction ? transaction.LOCK.UPDATE : undefined,
  });
  if (!compound) throw new AppError('not_found', 'No compound with this id in this lab.', 404);
  return compound;
}

/**
 * Researchers change what they entered themselves; reviewers and admins curate everything
 * (docs/product.md, section 2).
 */
export function assertMayEdit(lab: LabContext, actor: Actor, record: { createdById: string | null }, what: string) {
  if (roleAtLeast(lab.role, 'reviewer') || (record.createdById !== null && record.createdById === actor.userId)) return;
  throw new AppError(
    'not_yours',
    `Only the person who entered this ${what}, or a reviewer or admin, can change it.`,
    403,
  );
}

/** 409 when the client edits from an older copy than the one stored. */
export function assertVersion(record: { version: number }, sent: number | undefined, what: string) {
  if (sent === undefined || sent === record.version) return;
  throw new AppError(
    'stale_version',
    `This ${what} was changed by someone else since you opened it ` +
      `(you have version ${sent}, the library has ${record.version}). Reload and apply your change again.`,
    409,
    [{ path: 'body.version', message: `is ${sent}; the current version is ${record.version}` }],
  );
}

/** The lab's display reference electrode and solvent. */
export async function labDisplaySettings(
  labId: string,
  transaction?: Transaction,
): Promise<{ displayReference: string; displaySolvent: string }> {
  const lab = await Lab.findByPk(labId, { transaction, attributes: ['id', 'displayReference', 'displaySolvent'] });
  if (!lab) throw new AppError('not_found', 'No such lab, or you are not a member of it.', 404);
  return { displayReference: lab.displayReference, displaySolvent: lab.displaySolvent };
}

/** Only the fields that change, before and after, for the audit trail. */
export function changedFields(before: Record<string, unknown>, changes: Record<string, unknown>) {
  const from: Record<string, unknown> = {};
  const to: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(changes)) {
    if (value === undefined || before[key] === value) continue;
    from[key] = before[key] ?? null;
    to[key] = value;
  }
  return { from, to };
}
