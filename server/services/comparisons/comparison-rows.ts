import { Op } from 'sequelize';
import type { ComparisonRow } from '@shared/schemas/comparisons';
import type { LabContext } from '../../domain/lab-context';
import { Compound, Study, StudyFit } from '../../models';
import {
  drivingForceOfStudyFrom,
  loadDrivingForceInputs,
  type DrivingForceInputs,
} from '../library/driving-force.service';

type RowDrivingForce = Pick<ComparisonRow, 'drivingForce' | 'drivingForceMissing'>;

/** The highlighted driving force of a study's pair in its solvent, or why there is none. */
function rowDrivingForce(inputs: DrivingForceInputs, study: Study): RowDrivingForce {
  const result = drivingForceOfStudyFrom(inputs, study);
  if (!result)
    return { drivingForce: null, drivingForceMissing: 'custom solvent: no permittivity in the solvent table' };
  const pathway = result.highlighted;
  const value = pathway ? result[pathway] : null;
  if (!pathway || !value) {
    return {
      drivingForce: null,
      drivingForceMissing: result.missing.map((item) => item.message).join('; ') || 'potentials missing',
    };
  }
  return {
    drivingForce: { pathway, electronvolts: value.electronvolts, withWorkTerm: value.withWorkTerm },
    drivingForceMissing: null,
  };
}

/**
 * One row per current study of the compound (as emitter: each quencher; as quencher: each
 * emitter), with kq and K_SV and their standard errors from the newest fit, flags, status and
 * the driving force.
 */
export async function comparisonRows(
  lab: LabContext,
  side: 'emitter' | 'quencher',
  compoundId: string,
): Promise<ComparisonRow[]> {
  const studies = await Study.findAll({
    where: { labId: lab.id, isCurrent: true, [side === 'emitter' ? 'emitterId' : 'quencherId']: compoundId },
    include: [{ model: Compound, as: side === 'emitter' ? 'quencher' : 'emitter' }],
    order: [['updatedAt', 'DESC']],
    limit: 500,
  });
  const fitIds = studies.map((study) => study.latestFitId).filter((id): id is string => id !== null);
  const fits = new Map(
    (await StudyFit.findAll({ where: { id: { [Op.in]: fitIds } }, attributes: ['id', 'result'] })).map((fit) => [
      fit.id,
      fit,
    ]),
  );
  // The library's numbers for every compound on the page are read once (four queries, not five per
  // pair); replicates and revisions of one pair share a driving force: computed once per pair,
  // solvent and pin.
  const inputs = await loadDrivingForceInputs(
    lab,
    [...new Set(studies.flatMap((study) => [study.emitterId, study.quencherId]))],
    [...new Set(studies.map((study) => study.emitterId))],
  );
  const forces = new Map<string, RowDrivingForce>();
  const forceOf = (study: Study) => {
    const key = [study.emitterId, study.quencherId, study.solventId, study.pinnedMechanism].join('|');
    if (!forces.has(key)) forces.set(key, rowDrivingForce(inputs, study));
    return forces.get(key)!;
  };
  const rows: ComparisonRow[] = [];
  for (const study of studies) {
    const result = study.latestFitId ? fits.get(study.latestFitId)?.result : undefined;
    const partner = side === 'emitter' ? study.quencher : study.emitter;
    rows.push({
      studyId: study.id,
      title: study.title,
      partner: { id: partner?.id ?? '', name: partner?.name ?? '' },
      solvent: study.solventId ?? study.customSolventName ?? '',
      status: study.status,
      kq: study.kq === null ? null : { value: study.kq, standardError: result?.parameters.kq?.standardError ?? null },
      kSv:
        study.kSv === null ? null : { value: study.kSv, standardError: result?.parameters.kSv?.standardError ?? null },
      flags: (result?.flags ?? []).map((flag) => ({ code: flag.code, title: flag.title })),
      ...forceOf(study),
    });
  }
  return rows;
}
