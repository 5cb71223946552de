import { diffusionLimitFor } from '@shared/engine';
import type { ComparisonRow } from '@shared/schemas/comparisons';
import type { LabContext } from '../../domain/lab-context';
import { selectRows } from '../../db/select-rows';
import { Study } from '../../models';
import { mechanismEvidenceOfStudies } from '../mechanism/mechanism-evidence.service';
import {
  drivingForceOfStudyFrom,
  loadDrivingForceInputs,
  type DrivingForceInputs,
  type StudyPair,
} from '../library/driving-force.service';

type RowDrivingForce = Pick<ComparisonRow, 'drivingForce' | 'drivingForceMissing'>;

/** The highlighted driving force of a study's pair in its solvent, or why there is none. */
function rowDrivingForce(inputs: DrivingForceInputs, study: StudyPair): RowDrivingForce {
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
 * k_diff at the study's own temperature, as its fit reads it (engine diffusionLimitFor): the
 * entered viscosity, else eta(T) of the solvent's correlation; null for a custom solvent without one.
 */
function rowDiffusionLimit(study: StudyRow): ComparisonRow['diffusionLimit'] {
  const notes: string[] = [];
  const limit = diffusionLimitFor(study, notes);
  return limit ? { value: limit.value, basis: limit.basis, note: notes[0] ?? null } : null;
}

type StudyRow = {
  id: string;
  title: string;
  emitterId: string;
  quencherId: string;
  solventId: string | null;
  customSolventName: string | null;
  customViscosity: number | null;
  temperature: number;
  pinnedMechanism: string | null;
  status: ComparisonRow['status'];
  kq: number | null;
  kSv: number | null;
  partnerId: string | null;
  partnerName: string | null;
  kqStandardError: number | null;
  kSvStandardError: number | null;
  flags: ComparisonRow['flags'] | null;
};

/**
 * The newest 500 current studies of the compound on one side (their ids from the compound's
 * index alone, migration 20261203-1545, then their rows by key), as plain rows with only what a
 * row shows: the partner's name, and from the newest fit only the two standard errors and the
 * flags' codes and titles (picked out of the stored result by PostgreSQL, not the whole result).
 */
const studiesSql = (side: 'emitter' | 'quencher') => {
  const [own, partner] = side === 'emitter' ? ['emitter_id', 'quencher_id'] : ['quencher_id', 'emitter_id'];
  return `
  SELECT s.id, s.title, s.emitter_id AS "emitterId", s.quencher_id AS "quencherId", s.solvent_id AS "solventId",
         s.custom_solvent_name AS "customSolventName", s.custom_viscosity AS "customViscosity", s.temperature,
         s.pinned_mechanism AS "pinnedMechanism", s.status,
         s.kq, s.k_sv AS "kSv", p.id AS "partnerId", p.name AS "partnerName",
         (f.result #>> '{parameters,kq,standardError}')::float8 AS "kqStandardError",
         (f.result #>> '{parameters,kSv,standardError}')::float8 AS "kSvStandardError",
         (SELECT json_agg(json_build_object('code', flag ->> 'code', 'title', flag ->> 'title') ORDER BY n)
            FROM jsonb_array_elements(f.result -> 'flags') WITH ORDINALITY AS x(flag, n)) AS flags
  FROM (SELECT t.* FROM studies t JOIN (
          SELECT id FROM studies WHERE lab_id = $1 AND is_current AND ${own} = $2
          ORDER BY updated_at DESC, id ASC LIMIT 500) k ON k.id = t.id) s
  LEFT JOIN compounds p ON p.id = s.${partner}
  LEFT JOIN study_fits f ON f.id = s.latest_fit_id
  ORDER BY s.updated_at DESC, s.id ASC`;
};

/**
 * One row per current study of the compound (as emitter: each quencher; as quencher: each
 * emitter), with kq and K_SV and their standard errors from the newest fit, flags, status, the
 * driving force, the combined mechanism verdict and k_diff at the study's temperature.
 */
export async function comparisonRows(
  lab: LabContext,
  side: 'emitter' | 'quencher',
  compoundId: string,
): Promise<ComparisonRow[]> {
  const studies = await selectRows<StudyRow>(Study.sequelize!, studiesSql(side), [lab.id, compoundId]);
  // The library's numbers for every compound on the page are read once (four queries, not five per
  // pair); replicates and revisions of one pair share a driving force: computed once per pair,
  // solvent and pin.
  // The mechanism verdicts of all rows come from a fixed number of statements too (not one per row).
  const [inputs, mechanisms] = await Promise.all([
    loadDrivingForceInputs(
      lab,
      [...new Set(studies.flatMap((study) => [study.emitterId, study.quencherId]))],
      [...new Set(studies.map((study) => study.emitterId))],
    ),
    mechanismEvidenceOfStudies(
      lab,
      studies.map((study) => study.id),
    ),
  ]);
  const forces = new Map<string, RowDrivingForce>();
  const forceOf = (study: StudyRow) => {
    const key = [study.emitterId, study.quencherId, study.solventId, study.pinnedMechanism].join('|');
    if (!forces.has(key)) forces.set(key, rowDrivingForce(inputs, study));
    return forces.get(key)!;
  };
  const limits = new Map<string, ComparisonRow['diffusionLimit']>();
  const limitOf = (study: StudyRow) => {
    const key = [study.solventId, study.customViscosity, study.temperature].join('|');
    if (!limits.has(key)) limits.set(key, rowDiffusionLimit(study));
    return limits.get(key)!;
  };
  return studies.map((study) => ({
    studyId: study.id,
    title: study.title,
    partner: { id: study.partnerId ?? '', name: study.partnerName ?? '' },
    solvent: study.solventId ?? study.customSolventName ?? '',
    status: study.status,
    kq: study.kq === null ? null : { value: study.kq, standardError: study.kqStandardError },
    kSv: study.kSv === null ? null : { value: study.kSv, standardError: study.kSvStandardError },
    flags: study.flags ?? [],
    ...forceOf(study),
    mechanism: mechanisms.get(study.id)?.verdict ?? 'unclear',
    temperature: study.temperature,
    diffusionLimit: limitOf(study),
  }));
}
