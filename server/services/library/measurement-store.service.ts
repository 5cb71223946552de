import type { Model, ModelStatic, Sequelize, Transaction } from 'sequelize';
import { AppError } from '../../lib/app-error';
import type { LabContext } from '../../domain/lab-context';
import { ExcitedStateEnergy, ExcitedStateLifetime, RedoxPotential, User } from '../../models';
import { recordLabAudit } from '../audit.service';
import type { Actor } from '../../domain/actor';
import { assertMayEdit, assertVersion, changedFields, findCompound } from './library-access.service';

/** The three kinds of per-compound measurement share one life cycle: add, edit (own or curate), delete (curate). */
export type MeasurementKind = 'potential' | 'lifetime' | 'energy';

interface MeasurementRow extends Model {
  id: string;
  labId: string;
  compoundId: string;
  createdById: string | null;
  version: number;
  createdBy?: User;
}

const stores = {
  potential: RedoxPotential,
  lifetime: ExcitedStateLifetime,
  energy: ExcitedStateEnergy,
} as unknown as Record<MeasurementKind, ModelStatic<MeasurementRow>>;
const words: Record<MeasurementKind, string> = {
  potential: 'redox potential',
  lifetime: 'lifetime',
  energy: 'E00 value',
};
const withAuthor = [{ model: User, as: 'createdBy', attributes: ['id', 'name'] }];

/**
 * Saves one measurement of a compound and its audit event, inside the caller's transaction: the
 * one way a potential, lifetime or E00 enters the library (the forms and the CSV import).
 */
export async function insertMeasurement(
  lab: LabContext,
  actor: Actor,
  kind: MeasurementKind,
  compound: { id: string; name: string },
  values: Record<string, unknown>,
  transaction: Transaction,
  details: Record<string, unknown> = {},
): Promise<MeasurementRow> {
  const row = await stores[kind].create(
    { ...values, labId: lab.id, compoundId: compound.id, createdById: actor.userId },
    { transaction },
  );
  await recordLabAudit({ lab, actor, transaction }, `${kind}_added`, [kind, row.id], {
    compound: compound.name,
    ...values,
    ...details,
  });
  return row;
}

export async function addMeasurement<T extends MeasurementRow>(
  sequelize: Sequelize,
  lab: LabContext,
  actor: Actor,
  kind: MeasurementKind,
  compoundId: string,
  values: Record<string, unknown>,
): Promise<T> {
  const id = await sequelize.transaction(async (transaction) => {
    const compound = await findCompound(lab, compoundId, transaction);
    const row = await insertMeasurement(lab, actor, kind, compound, values, transaction);
    return row.id;
  });
  return (await stores[kind].findByPk(id, { include: withAuthor })) as T;
}

async function loadForChange(
  sequelize: Sequelize,
  lab: LabContext,
  kind: MeasurementKind,
  compoundId: string,
  id: string,
) {
  const transaction = await sequelize.transaction();
  const row = await stores[kind].findOne({
    where: { id, compoundId, labId: lab.id },
    transaction,
    lock: transaction.LOCK.UPDATE,
  });
  if (!row) {
    await transaction.rollback();
    throw new AppError('not_found', `No ${words[kind]} with this id on this compound.`, 404);
  }
  return { row, transaction };
}

export async function updateMeasurement<T extends MeasurementRow>(
  sequelize: Sequelize,
  lab: LabContext,
  actor: Actor,
  kind: MeasurementKind,
  ids: { compoundId: string; id: string },
  changes: Record<string, unknown> & { version: number },
): Promise<T> {
  const { row, transaction } = await loadForChange(sequelize, lab, kind, ids.compoundId, ids.id);
  try {
    assertMayEdit(lab, actor, row, words[kind]);
    const { version, ...fields } = changes;
    assertVersion(row, version, words[kind]);
    const diff = changedFields(row.get({ plain: true }) as Record<string, unknown>, fields);
    await row.update(fields, { transaction });
    await recordLabAudit({ lab, actor, transaction }, `${kind}_changed`, [kind, row.id], diff);
    await transaction.commit();
  } catch (error) {
    await transaction.rollback();
    throw error;
  }
  return (await stores[kind].findByPk(row.id, { include: withAuthor })) as T;
}

export async function deleteMeasurement(
  sequelize: Sequelize,
  lab: LabContext,
  actor: Actor,
  kind: MeasurementKind,
  ids: { compoundId: string; id: string },
  version?: number,
): Promise<void> {
  const { row, transaction } = await loadForChange(sequelize, lab, kind, ids.compoundId, ids.id);
  try {
    assertVersion(row, version, words[kind]);
    const before = row.get({ plain: true }) as Record<string, unknown>;
    await row.destroy({ transaction });
    await recordLabAudit({ lab, actor, transaction }, `${kind}_deleted`, [kind, row.id], before);
    await transaction.commit();
  } catch (error) {
    await transaction.rollback();
    throw error;
  }
}

/** Every measurement of one kind for a set of compounds, oldest first, with who entered it. */
export function measurementsOf<T extends MeasurementRow>(kind: MeasurementKind, labId: string, compoundIds: string[]) {
  return stores[kind].findAll({
    where: { labId, compoundId: compoundIds },
    include: withAuthor,
    order: [['createdAt', 'ASC']],
  }) as Promise<T[]>;
}
