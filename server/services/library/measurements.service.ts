import type { Sequelize } from 'sequelize';
import { e00FromWavelength, EngineError } from '@shared/engine';
import type {
  EnergyChanges as EnergyUpdate,
  EnergyRecord,
  EnergyValues as EnergyInput,
  LifetimeChanges as LifetimeUpdate,
  LifetimeRecord,
  LifetimeValues as LifetimeInput,
  PotentialChanges as PotentialUpdate,
  PotentialValues as PotentialInput,
  RedoxPotentialRecord,
} from '@shared/schemas/library-measurements';
import { AppError } from '../../lib/app-error';
import type { LabContext } from '../../domain/lab-context';
import type { ExcitedStateEnergy, ExcitedStateLifetime, RedoxPotential, User } from '../../models';
import type { Actor } from '../../domain/actor';
import { toPotentialRecord } from './display-potential.service';
import { labDisplaySettings } from './library-access.service';
import { addMeasurement, deleteMeasurement, updateMeasurement } from './measurement-store.service';
import type { MeasurementKind } from './measurement-store.service';

type WithAuthor<T> = T & { createdBy?: User };
const authorName = (row: { createdBy?: User }) => row.createdBy?.name ?? null;

const trail = (row: WithAuthor<ExcitedStateLifetime | ExcitedStateEnergy>) => ({
  id: row.id,
  compoundId: row.compoundId,
  source: row.source ?? null,
  notes: row.notes ?? '',
  createdById: row.createdById ?? null,
  createdByName: authorName(row),
  version: row.version,
  createdAt: row.createdAt.toISOString(),
  updatedAt: row.updatedAt.toISOString(),
});

export const toLifetimeRecord = (row: WithAuthor<ExcitedStateLifetime>): LifetimeRecord => ({
  ...trail(row),
  value: row.value,
  uncertainty: row.uncertainty ?? null,
  solvent: row.solvent,
  atmosphere: row.atmosphere,
  temperature: row.temperature,
  method: row.method,
});

export const toEnergyRecord = (row: WithAuthor<ExcitedStateEnergy>): EnergyRecord => ({
  ...trail(row),
  value: row.value,
  wavelength: row.wavelength ?? null,
  method: row.method,
});

/** E00 entered as a wavelength is converted by the engine (E = 1239.84198 / lambda, CODATA) and the wavelength kept. */
function energyValues<T extends { value?: number; wavelength?: number }>(input: T) {
  if (input.wavelength === undefined) return input.value === undefined ? input : { ...input, wavelength: null };
  try {
    return { ...input, value: e00FromWavelength(input.wavelength) };
  } catch (error) {
    if (error instanceof EngineError) {
      throw new AppError('validation_failed', error.message, 400, [
        { path: 'body.wavelength', message: error.message },
      ]);
    }
    throw error;
  }
}

type Ids = { compoundId: string; id: string };
interface Context {
  sequelize: Sequelize;
  lab: LabContext;
  actor: Actor;
}

async function potentialOut(row: WithAuthor<RedoxPotential>, labId: string) {
  const { displayReference } = await labDisplaySettings(labId);
  return toPotentialRecord(row, displayReference, authorName(row));
}

export async function addPotential(
  { sequelize, lab, actor }: Context,
  compoundId: string,
  input: PotentialInput,
): Promise<RedoxPotentialRecord> {
  return potentialOut(
    await addMeasurement<RedoxPotential>(sequelize, lab, actor, 'potential', compoundId, input),
    lab.id,
  );
}
export async function changePotential(
  { sequelize, lab, actor }: Context,
  ids: Ids,
  input: PotentialUpdate,
): Promise<RedoxPotentialRecord> {
  return potentialOut(await updateMeasurement<RedoxPotential>(sequelize, lab, actor, 'potential', ids, input), lab.id);
}

export async function addLifetime(
  { sequelize, lab, actor }: Context,
  compoundId: string,
  input: LifetimeInput,
): Promise<LifetimeRecord> {
  return toLifetimeRecord(
    await addMeasurement<ExcitedStateLifetime>(sequelize, lab, actor, 'lifetime', compoundId, input),
  );
}
export async function changeLifetime(
  { sequelize, lab, actor }: Context,
  ids: Ids,
  input: LifetimeUpdate,
): Promise<LifetimeRecord> {
  return toLifetimeRecord(await updateMeasurement<ExcitedStateLifetime>(sequelize, lab, actor, 'lifetime', ids, input));
}

export async function addEnergy(
  { sequelize, lab, actor }: Context,
  compoundId: string,
  input: EnergyInput,
): Promise<EnergyRecord> {
  return toEnergyRecord(
    await addMeasurement<ExcitedStateEnergy>(sequelize, lab, actor, 'energy', compoundId, energyValues(input)),
  );
}
export async function changeEnergy(
  { sequelize, lab, actor }: Context,
  ids: Ids,
  input: EnergyUpdate,
): Promise<EnergyRecord> {
  return toEnergyRecord(
    await updateMeasurement<ExcitedStateEnergy>(sequelize, lab, actor, 'energy', ids, energyValues(input)),
  );
}

export async function removeMeasurement(
  { sequelize, lab, actor }: Context,
  kind: MeasurementKind,
  ids: Ids,
  version?: number,
) {
  await deleteMeasurement(sequelize, lab, actor, kind, ids, version);
}
