import type { Transaction } from 'sequelize';
import { Op } from 'sequelize';
import { AppError } from '../../lib/app-error';
import type { LabContext } from '../../domain/lab-context';
import { Compound } from '../../models';
import { recordLabAudit } from '../audit.service';
import type { Actor } from '../../domain/actor';

const noSuchCompound = (field: string) =>
  new AppError('validation_failed', 'No compound with this id in this lab.', 400, [
    { path: `body.${field}`, message: 'no compound with this id in this lab' },
  ]);

/**
 * A compound named inline on the study form. A new name that matches a compound of the lab (any
 * capitalisation) reuses it; otherwise the compound is created with the role hint, as the library
 * would (only name and role).
 */
async function compoundNamed(
  lab: LabContext,
  newName: string,
  role: 'photocatalyst' | 'quencher',
  actor: Actor,
  transaction: Transaction,
): Promise<string> {
  const name = newName.trim();
  const existing = await Compound.findOne({
    where: { labId: lab.id, name: { [Op.iLike]: name.replace(/[\\%_]/g, '\\$&') } },
    attributes: ['id'],
    transaction,
  });
  if (existing) return existing.id;
  const compound = await Compound.create(
    { labId: lab.id, name, roleHint: role, createdById: actor.userId },
    { transaction },
  );
  await recordLabAudit({ lab, actor, transaction }, 'compound_created', ['compound', compound.id], {
    after: { name, roleHint: role },
    via: 'study form',
  });
  return compound.id;
}

const sides = [
  { idKey: 'emitterId', nameKey: 'newEmitterName', role: 'photocatalyst' },
  { idKey: 'quencherId', nameKey: 'newQuencherName', role: 'quencher' },
] as const;

/**
 * The emitter and quencher a study form names, each by id (an existing compound of this lab) or
 * by a new name (see compoundNamed), emitter first. The sides named by id are checked in one
 * query. A side the input does not name is left out of the answer (an update keeps it).
 */
export async function resolveStudyCompounds(
  lab: LabContext,
  input: { emitterId?: string | null; newEmitterName?: string; quencherId?: string | null; newQuencherName?: string },
  actor: Actor,
  /** needed when a side is named anew (its compound is created in it) */
  transaction: Transaction | undefined,
): Promise<{ emitterId?: string; quencherId?: string }> {
  const ids = sides.map(({ idKey }) => input[idKey]).filter((id): id is string => Boolean(id));
  const found = new Set(
    ids.length === 0
      ? []
      : (await Compound.findAll({ where: { id: ids, labId: lab.id }, attributes: ['id'], raw: true, transaction })).map(
          (compound) => compound.id,
        ),
  );
  const chosen: { emitterId?: string; quencherId?: string } = {};
  for (const { idKey, nameKey, role } of sides) {
    const id = input[idKey];
    const newName = input[nameKey];
    if (id) {
      if (!found.has(id)) throw noSuchCompound(idKey);
      chosen[idKey] = id;
    } else if (newName) {
      if (!transaction) throw new Error('A compound named anew on the study form is created inside a transaction.');
      chosen[idKey] = await compoundNamed(lab, newName, role, actor, transaction);
    }
  }
  return chosen;
}
