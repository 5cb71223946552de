import type { Transaction } from 'sequelize';
import { Op } from 'sequelize';
import { AppError } from '../../lib/app-error';
import type { LabContext } from '../../domain/lab-context';
import { Compound } from '../../models';
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

const sides = [
  { idKey: 'emitterId', nameKey: 'newEmitterName', role: 'photocatalyst' },
  { idKey: 'quencherId', nameKey: 'newQuencherName', role: 'quencher' },
] as const;

/**
 * The emitter and quencher a study form names, each by id or by a new name (see resolveCompound),
 * emitter first. A side the input does not name is left out of the answer (an update keeps it).
 */
export async function resolveStudyCompounds(
  lab: LabContext,
  input: { emitterId?: string | null; newEmitterName?: string; quencherId?: string | null; newQuencherName?: string },
  actor: Actor,
  transaction: Transaction,
): Promise<{ emitterId?: string; quencherId?: string }> {
  const chosen: { emitterId?: string; quencherId?: string } = {};
  for (const { idKey, nameKey, role } of sides) {
    const choice = { id: input[idKey], newName: input[nameKey] };
    if (choice.id || choice.newName)
      chosen[idKey] = (await resolveCompound(lab, choice, role, idKey, actor, transaction)).id;
  }
  return chosen;
}
