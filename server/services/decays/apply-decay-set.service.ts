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
 * no concentration. `refit` places a set fitted again: only into the points whose lifetime still
 * comes from it (one the person typed over stays theirs), no point is added, and tau0 only when
 * it still comes from the set; the history names the refit. Answers what it changed.
 */
export async function placeDecaySet(
  study: Study,
  set: DecaySet,
  actor: Actor,
  transaction: Transaction,
  mode: 'apply' | 'refit' = 'apply',
): Promise<{ points: number; tau0: boolean }> {
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
  const refit = mode === 'refit';
  const filled = new Set<number>();
  // A point already fed by this set is its decay's first choice, so placing again lands where it did before.
  const candidates = (concentration: number) =>
    points
      .map((point, i) => ({ point, i }))
      .filter(({ point, i }) => !filled.has(i) && sameConcentration(point.concentration, concentration))
      .filter(({ point }) => !refit || point.lifetimeDecaySetId === set.id)
      .sort((a, b) => Number(b.point.lifetimeDecaySetId === set.id) - Number(a.point.lifetimeDecaySetId === set.id));
  for (const decay of fittedWithConcentration(set.outcomes)) {
    const fromDecay = {
      lifetime: decay.lifetime.value,
      lifetimeUncertainty: decay.lifetime.standardError,
      lifetimeDecaySetId: set.id,
    };
    const match = candidates(decay.concentration)[0]?.i;
    if (match !== undefined) {
      Object.assign(points[match]!, fromDecay);
      filled.add(match);
    } else if (!refit) {
      filled.add(points.push({ ...pointAt(decay.concentration), uploadId: null, ...fromDecay }) - 1);
    }
  }
  const blanks = tau0FromBlanks(set.outcomes);
  const tau0 = blanks && (!refit || study.tau0DecaySetId === set.id) ? blanks : null;
  if (refit && filled.size === 0 && !tau0) return { points: 0, tau0: false };
  if (tau0)
    await study.update(
      { tau0: tau0.value, tau0Uncertainty: tau0.standardError, tau0LifetimeId: null, tau0DecaySetId: set.id },
      { transaction },
    );
  await writeSeries(study, points, actor, transaction, {
    action: refit ? 'study_lifetimes_refitted' : 'study_lifetimes_from_decays',
    decaySetId: set.id,
    ...(tau0 ? { tau0 } : {}),
  });
  return { points: filled.size, tau0: tau0 !== null };
}
