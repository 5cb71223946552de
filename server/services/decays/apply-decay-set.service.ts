import type { Sequelize, Transaction } from 'sequelize';
import { pointAt } from '@shared/schemas/study-points';
import { AppError } from '../../lib/app-error';
import type { LabContext } from '../../domain/lab-context';
import type { Actor, SignedInActor } from '../../domain/actor';
import { DecaySet, StudyPoint, type Study } from '../../models';
import { loadStudy, requireChangeable } from '../studies/study-access';
import { storedSeriesPoint, writeSeries } from '../studies/study-points.service';
import { fittedWithConcentration, tau0FromBlanks } from './decay-stern-volmer';

// Concentrations read from a header and typed in a grid agree to rounding, not bit for bit.
const sameConcentration = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));

/**
 * Puts a kept decay set's lifetimes into its study: each decay fills the lifetime (with its
 * standard error and the set as source) of the next point at its concentration, or becomes a
 * new point with only a lifetime; the zero-concentration decays give tau0 (their weighted mean).
 * One transaction, version-checked; the study is fitted again as after any change of points.
 */
export async function applyDecaySet(
  sequelize: Sequelize,
  lab: LabContext,
  studyId: string,
  setId: string,
  input: { version: number },
  actor: SignedInActor,
): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const study = await loadStudy(lab, studyId, transaction);
    requireChangeable(study, lab, actor.userId, input.version);
    const set = await DecaySet.findOne({ where: { id: setId, labId: lab.id, studyId }, transaction });
    if (!set) throw new AppError('not_found', 'No decay set with this id in this study.', 404);
    await placeDecaySet(study, set, actor, transaction);
  });
}

/**
 * The placing itself, inside the caller's transaction, for a study already checked as
 * changeable (the demo seed uses it too): refused (422, nothing saved) when a fitted decay has
 * no concentration.
 */
export async function placeDecaySet(
  study: Study,
  set: DecaySet,
  actor: Actor,
  transaction: Transaction,
): Promise<void> {
  const unplaced = set.outcomes.filter((outcome) => outcome.lifetime !== null && outcome.concentration === null);
  if (unplaced.length > 0)
    throw new AppError(
      'concentration_needed',
      `Nothing was saved: decay "${unplaced[0]!.label}" has no quencher concentration; keep the set again with the concentration given.`,
      422,
      unplaced.map((outcome) => ({ path: `decays.${outcome.index}.concentration`, message: 'missing' })),
    );
  const existing = await StudyPoint.findAll({
    where: { studyId: study.id },
    order: [['position', 'ASC']],
    transaction,
  });
  const points = existing.map(storedSeriesPoint);
  const filled = new Set<number>();
  for (const decay of fittedWithConcentration(set.outcomes)) {
    const fromDecay = {
      lifetime: decay.lifetime.value,
      lifetimeUncertainty: decay.lifetime.standardError,
      lifetimeDecaySetId: set.id,
    };
    const match = points.findIndex(
      (point, i) => !filled.has(i) && sameConcentration(point.concentration, decay.concentration),
    );
    if (match !== -1) {
      Object.assign(points[match]!, fromDecay);
      filled.add(match);
    } else {
      filled.add(points.push({ ...pointAt(decay.concentration), uploadId: null, ...fromDecay }) - 1);
    }
  }
  const tau0 = tau0FromBlanks(set.outcomes);
  if (tau0)
    await study.update(
      { tau0: tau0.value, tau0Uncertainty: tau0.standardError, tau0LifetimeId: null, tau0DecaySetId: set.id },
      { transaction },
    );
  await writeSeries(study, points, actor, transaction, {
    action: 'study_lifetimes_from_decays',
    decaySetId: set.id,
    ...(tau0 ? { tau0 } : {}),
  });
}
