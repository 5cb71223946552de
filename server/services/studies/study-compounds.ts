import type { Transaction } from 'sequelize';
import { Op } from 'sequelize';
import { AppError } from '../../lib/app-error';
import type { LabContext } from '../../domain/lab-context';
import { Compound, ExcitedStateLifetime } from '../../models';
import { recordAudit } from '../audit.service';
import type { Actor } from '../../domain/actor';

/**
 * The emitter or quencher of a study: an existing compound of this lab, or one named inline.
 * A new name that matches a compound of the lab (any capitalisation) reuses it; otherwise the
 * compound is created with the role hint, as the library would (only name and role).
 */
export async function resolveCompound(
  lab: LabContext,
  choice: { id?: string | null; newName?: string },
  role: 'photocatalyst' | 'quencher',
  field: string,
  actor: Actor,
  transaction: Transaction,
): Promise<Compound> {
  if (choice.id) {
    const compound = await Compound.findOne({ where: { id: choice.id, labId: lab.id }, transaction });
    if (!compound)
      throw new AppError('validation_failed', 'No compound with this id in this lab.', 400, [
        { path: `body.${field}`, message: 'no compound with this id in this lab' },
      ]);
    return compound;
  }
  const name = choice.newName!.trim();
  const existing = await Compound.findOne({
    where: { labId: lab.id, name: { [Op.iLike]: name.replace(/[\\%_]/g, '\\$&') } },
    transaction,
  });
  if (existing) return existing;
  const compound = await Compound.create(
    { labId: lab.id, name, roleHint: role, createdById: actor.userId },
    { transaction },
  );
  await recordAudit(
    actor,
    {
      action: 'compound_created',
      labId: lab.id,
      targetType: 'compound',
      targetId: compound.id,
      details: { after: { name, roleHint: role }, via: 'study form' },
    },
    transaction,
  );
  return compound;
}

/** A lifetime record used as tau0 must be the emitter's, in this lab; its value and uncertainty become tau0. */
export async function lifetimeForTau0(
  lab: LabContext,
  lifetimeId: string,
  emitterId: string,
  transaction: Transaction,
): Promise<{ tau0: number; tau0Uncertainty: number | null }> {
  const lifetime = await ExcitedStateLifetime.findOne({ where: { id: lifetimeId, labId: lab.id }, transaction });
  if (!lifetime || lifetime.compoundId !== emitterId) {
    throw new AppError('validation_failed', "The lifetime record must belong to the study's emitter.", 400, [
      { path: 'body.tau0LifetimeId', message: 'no lifetime of this emitter with this id' },
    ]);
  }
  return { tau0: lifetime.value, tau0Uncertainty: lifetime.uncertainty ?? null };
}
