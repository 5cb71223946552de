import { ForeignKeyConstraintError, literal, Op } from 'sequelize';
import type { Sequelize } from 'sequelize';
import type {
  CompoundChanges,
  CompoundList,
  CompoundListQuery,
  CompoundSummary,
  CompoundValues,
} from '@shared/schemas/library';
import type { CompoundDetail } from '@shared/schemas/library-views';
import { fixedStatementOf, selectRows } from '../../db/select-rows';
import { AppError } from '../../lib/app-error';
import type { LabContext } from '../../domain/lab-context';
import { Compound, User } from '../../models';
import type { ExcitedStateEnergy, ExcitedStateLifetime, RedoxPotential } from '../../models';
import { recordLabAudit } from '../audit.service';
import type { Actor } from '../../domain/actor';
import { toPotentialRecord } from './display-potential.service';
import { excitedStateOf } from './excited-state.service';
import {
  assertMayEdit,
  assertVersion,
  changedFields,
  findCompound,
  labDisplaySettings,
} from './library-access.service';
import { measurementsOf } from './measurement-store.service';
import { toEnergyRecord, toLifetimeRecord } from './measurements.service';

const count = (table: string) =>
  literal(`(SELECT count(*)::int FROM ${table} AS m WHERE m.compound_id = "Compound"."id")`);
const summaryAttributes = {
  include: [
    [count('redox_potentials'), 'potentialCount'],
    [count('excited_state_lifetimes'), 'lifetimeCount'],
    [count('excited_state_energies'), 'energyCount'],
  ] as [ReturnType<typeof literal>, string][],
};

function toSummary(compound: Compound & { createdBy?: User }): CompoundSummary {
  const counted = (key: string) => Number(compound.get(key) ?? 0);
  return {
    id: compound.id,
    name: compound.name,
    roleHint: compound.roleHint,
    smiles: compound.smiles ?? null,
    formula: compound.formula ?? null,
    notes: compound.notes ?? '',
    emissiveState: compound.emissiveState ?? null,
    tripletEnergy: compound.tripletEnergy ?? null,
    tripletEnergySource: compound.tripletEnergySource ?? null,
    charge: compound.charge ?? 0,
    counts: {
      potentials: counted('potentialCount'),
      lifetimes: counted('lifetimeCount'),
      energies: counted('energyCount'),
    },
    createdById: compound.createdById ?? null,
    createdByName: compound.createdBy?.name ?? null,
    version: compound.version,
    createdAt: compound.createdAt.toISOString(),
    updatedAt: compound.updatedAt.toISOString(),
  };
}

const withAuthor = [{ model: User, as: 'createdBy', attributes: ['id', 'name'] }];
// A role filter for emitters or quenchers also lists compounds marked "both".
const roleFilter = {
  photocatalyst: ['photocatalyst', 'both'],
  quencher: ['quencher', 'both'],
  both: ['both'],
} as const;

type SummaryRow = Omit<CompoundSummary, 'counts' | 'createdAt' | 'updatedAt'> & {
  potentials: number;
  lifetimes: number;
  energies: number;
  createdAt: Date;
  updatedAt: Date;
  total: number;
};

// The library's list in one statement of plain rows (no model instances): the page, each
// compound's measurement counts and author, and the number of matches beside each row. A lab's
// compounds are few and read through its own index whatever the values, so each of the four texts
// (with or without a name search and a role filter) runs prepared: planning took longer than the
// run (about 0.43 against 0.25 ms per call under the load benchmark's read mix, pg_stat_statements).
const listSql = (where: string, binds: number) => `
  SELECT c.id, c.name, c.role_hint AS "roleHint", c.smiles, c.formula, c.notes, c.emissive_state AS "emissiveState",
         c.triplet_energy AS "tripletEnergy", c.triplet_energy_source AS "tripletEnergySource", c.charge,
         (SELECT count(*)::int FROM redox_potentials m WHERE m.compound_id = c.id) AS potentials,
         (SELECT count(*)::int FROM excited_state_lifetimes m WHERE m.compound_id = c.id) AS lifetimes,
         (SELECT count(*)::int FROM excited_state_energies m WHERE m.compound_id = c.id) AS energies,
         c.created_by_id AS "createdById", u.name AS "createdByName", c.version,
         c.created_at AS "createdAt", c.updated_at AS "updatedAt", c.total
  FROM (SELECT *, count(*) OVER ()::int AS total FROM compounds WHERE ${where}
        ORDER BY name ASC, id ASC LIMIT $${binds + 1} OFFSET $${binds + 2}) c
  LEFT JOIN users u ON u.id = c.created_by_id
  ORDER BY c.name ASC, c.id ASC`;

export async function listCompounds(
  lab: LabContext,
  query: CompoundListQuery & { page: number; pageSize: number },
): Promise<CompoundList> {
  const values: unknown[] = [lab.id];
  const where = ['lab_id = $1'];
  if (query.search) {
    values.push(`%${query.search.replace(/[\\%_]/g, '\\$&')}%`);
    where.push(`name ILIKE $${values.length}`);
  }
  if (query.roleHint) {
    values.push([...roleFilter[query.roleHint]]);
    where.push(`role_hint::text = ANY($${values.length}::text[])`);
  }
  const sequelize = Compound.sequelize!;
  const sql = fixedStatementOf(listSql(where.join(' AND '), values.length));
  const offset = (query.page - 1) * query.pageSize;
  const rows = await selectRows<SummaryRow>(sequelize, sql, [...values, query.pageSize, offset]);
  // A page past the end has no row to carry the number of matches: the first row tells it.
  const [counted] = rows.length || !offset ? rows : await selectRows<SummaryRow>(sequelize, sql, [...values, 1, 0]);
  return {
    // Named field by field: a rest and a spread per row cost several times more (see toSummary in
    // services/studies/study-serialize.ts).
    items: rows.map((row) => ({
      id: row.id,
      name: row.name,
      roleHint: row.roleHint,
      smiles: row.smiles,
      formula: row.formula,
      notes: row.notes,
      emissiveState: row.emissiveState,
      tripletEnergy: row.tripletEnergy,
      tripletEnergySource: row.tripletEnergySource,
      charge: row.charge,
      createdById: row.createdById,
      createdByName: row.createdByName,
      version: row.version,
      counts: { potentials: row.potentials, lifetimes: row.lifetimes, energies: row.energies },
      createdAt: row.createdAt.toISOString(),
      updatedAt: row.updatedAt.toISOString(),
    })),
    total: counted?.total ?? 0,
    page: query.page,
    pageSize: query.pageSize,
  };
}

export async function getCompound(lab: LabContext, compoundId: string): Promise<CompoundDetail> {
  const compound = await Compound.findOne({
    where: { id: compoundId, labId: lab.id },
    attributes: summaryAttributes,
    include: withAuthor,
  });
  if (!compound) throw new AppError('not_found', 'No compound with this id in this lab.', 404);
  const { displayReference } = await labDisplaySettings(lab.id);
  const potentials = await measurementsOf<RedoxPotential & { createdBy?: User }>('potential', lab.id, [compound.id]);
  const lifetimes = await measurementsOf<ExcitedStateLifetime>('lifetime', lab.id, [compound.id]);
  const energies = await measurementsOf<ExcitedStateEnergy>('energy', lab.id, [compound.id]);
  return {
    ...toSummary(compound),
    displayReference,
    potentials: potentials.map((row) => toPotentialRecord(row, displayReference, row.createdBy?.name ?? null)),
    lifetimes: lifetimes.map(toLifetimeRecord),
    energies: energies.map(toEnergyRecord),
    excitedState: excitedStateOf(compound.name, potentials, energies, displayReference),
  };
}

const nameTaken = (name: string) =>
  new AppError('name_taken', `The library already has a compound called "${name}".`, 409, [
    { path: 'body.name', message: 'is already used by another compound in this lab' },
  ]);

async function assertNameFree(labId: string, name: string, exceptId?: string) {
  const clash = await Compound.findOne({
    where: { labId, [Op.and]: [literal(`lower("Compound"."name") = lower(${Compound.sequelize!.escape(name)})`)] },
  });
  if (clash && clash.id !== exceptId) throw nameTaken(name);
}

export async function createCompound(
  sequelize: Sequelize,
  lab: LabContext,
  actor: Actor,
  input: CompoundValues,
): Promise<CompoundDetail> {
  await assertNameFree(lab.id, input.name);
  const id = await sequelize.transaction(async (transaction) => {
    const compound = await Compound.create({ ...input, labId: lab.id, createdById: actor.userId }, { transaction });
    await recordLabAudit({ lab, actor, transaction }, 'compound_added', ['compound', compound.id], { ...input });
    return compound.id;
  });
  return getCompound(lab, id);
}

export async function updateCompound(
  sequelize: Sequelize,
  lab: LabContext,
  actor: Actor,
  compoundId: string,
  changes: CompoundChanges,
): Promise<CompoundDetail> {
  const { version, ...fields } = changes;
  if (fields.name) await assertNameFree(lab.id, fields.name, compoundId);
  await sequelize.transaction(async (transaction) => {
    const compound = await findCompound(lab, compoundId, transaction, true);
    assertMayEdit(lab, actor, compound, 'compound');
    assertVersion(compound, version, 'compound');
    const diff = changedFields(compound.get({ plain: true }), fields);
    await compound.update(fields, { transaction });
    await recordLabAudit({ lab, actor, transaction }, 'compound_changed', ['compound', compound.id], diff);
  });
  return getCompound(lab, compoundId);
}

export async function deleteCompound(
  sequelize: Sequelize,
  lab: LabContext,
  actor: Actor,
  compoundId: string,
  version?: number,
) {
  try {
    await sequelize.transaction(async (transaction) => {
      const compound = await findCompound(lab, compoundId, transaction, true);
      assertVersion(compound, version, 'compound');
      const before = compound.get({ plain: true });
      await compound.destroy({ transaction });
      await recordLabAudit({ lab, actor, transaction }, 'compound_deleted', ['compound', compoundId], before);
    });
  } catch (error) {
    if (error instanceof ForeignKeyConstraintError) {
      throw new AppError('compound_in_use', 'Studies in this lab use this compound, so it stays in the library.', 409);
    }
    throw error;
  }
}
