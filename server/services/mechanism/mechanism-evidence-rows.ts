import type { Sequelize } from 'sequelize';
import type { AbsorptionAnalysisAnswer, AssociationFit } from '@shared/schemas/absorption-titrations';
import type { SpectrumMatrixAnalysisAnswer } from '@shared/schemas/spectrum-matrices';
import type { Estimate, FitResult } from '@shared/schemas/study-fits';
import type { FitModel } from '@shared/schemas/studies';
import { selectRows } from '../../db/select-rows';
import type { SeriesMember } from './temperature-series.service';

/** A study of the batch or of one of their series, with what the mechanism evidence reads of its newest fit. */
export interface EvidenceStudyRow extends SeriesMember {
  emitterId: string;
  quencherId: string;
  customSolventName: string | null;
  isCurrent: boolean;
  fitModel: FitModel | null;
  degreesOfFreedom: number | null;
  diffusionLimit: FitResult['diffusionLimit'];
  /** 'no-intensity-data': the fit is the lifetime line itself (lifetimes only); null in older fits */
  intensityFit: 'fitted' | 'no-intensity-data' | null;
  /** the fit's lifetime line without its points: only how many there were */
  lifetime: { kSv: Estimate; intercept: 'free' | 'fixed-at-one' | null; pointCount: number } | null;
}

/** The most studies of one pair in one solvent a series is read from (the coolest first). */
export const SERIES_LIMIT = 40;

/**
 * The studies asked for and the first SERIES_LIMIT current studies of the same pair in the same
 * solvent by temperature, then id (their temperature series: a series is read from no more), each
 * with the few parts of its newest fit the evidence reads (picked out by PostgreSQL, not the whole
 * result with its points): one statement for any number of studies. Reading every study of each
 * pair made a comparison of 500 studies in 3 pairs of 833 studies each read 2,500 rows where 620
 * were used (bench:studies, big lab).
 */
const STUDIES_SQL = `
  WITH target AS (
    SELECT id, emitter_id, quencher_id, solvent_id, custom_solvent_name FROM studies
    WHERE lab_id = $1 AND id = ANY($2::uuid[])),
  pair AS (SELECT DISTINCT emitter_id, quencher_id, solvent_id, custom_solvent_name FROM target),
  member AS (
    SELECT m.id FROM pair p CROSS JOIN LATERAL (
      SELECT s.id FROM studies s
      WHERE s.lab_id = $1 AND s.is_current AND s.emitter_id = p.emitter_id AND s.quencher_id = p.quencher_id
        AND s.solvent_id IS NOT DISTINCT FROM p.solvent_id
        AND s.custom_solvent_name IS NOT DISTINCT FROM p.custom_solvent_name
      ORDER BY s.temperature ASC, s.id ASC LIMIT ${SERIES_LIMIT}) m
    UNION SELECT id FROM target)
  SELECT s.id, s.title, s.status, s.temperature, s.solvent_id AS "solventId",
         s.custom_viscosity AS "customViscosity", s.k_sv AS "kSv", s.kq,
         s.emitter_id AS "emitterId", s.quencher_id AS "quencherId",
         s.custom_solvent_name AS "customSolventName", s.is_current AS "isCurrent",
         f.model AS "fitModel", f.result -> 'parameters' AS parameters, f.result ->> 'intensity' AS "intensityFit",
         (f.result #>> '{statistics,degreesOfFreedom}')::float8 AS "degreesOfFreedom",
         f.result -> 'diffusionLimit' AS "diffusionLimit",
         CASE WHEN jsonb_typeof(f.result -> 'lifetime') = 'object' THEN jsonb_build_object(
           'kSv', f.result #> '{lifetime,kSv}',
           'intercept', f.result #> '{lifetime,intercept}',
           'pointCount', jsonb_array_length(f.result #> '{lifetime,points}')) END AS lifetime
  FROM member m
  JOIN studies s ON s.id = m.id
  LEFT JOIN study_fits f ON f.id = s.latest_fit_id AND f.study_id = s.id
  ORDER BY s.temperature ASC, s.id ASC`;

export function evidenceStudyRows(sequelize: Sequelize, labId: string, studyIds: string[]) {
  return selectRows<EvidenceStudyRow>(sequelize, STUDIES_SQL, [labId, studyIds]);
}

/**
 * The newest spectrum matrix (kind 'emission') and absorption titration of a study, without their
 * bands; a titration with the K_a its verdict uses (null: the isotherm, as kept before re-analysis).
 */
export type NewestMatrixRow =
  | { id: string; studyId: string; kind: 'emission'; analysis: Omit<SpectrumMatrixAnalysisAnswer, 'bands'> }
  | {
      id: string;
      studyId: string;
      kind: 'absorption';
      analysis: Omit<AbsorptionAnalysisAnswer, 'bands'>;
      associationFit: AssociationFit | null;
    };

const MATRICES_SQL = `
  SELECT DISTINCT ON (study_id, kind) id, study_id AS "studyId", kind, analysis - 'bands' AS analysis,
         options ->> 'associationFit' AS "associationFit"
  FROM spectrum_matrices
  WHERE lab_id = $1 AND study_id = ANY($2::uuid[]) AND kind IN ('emission', 'absorption')
    AND id <> ALL($3::uuid[])
  ORDER BY study_id, kind, created_at DESC`;

/** `leaveOut`: records read as gone (a discard about to be written, PendingSpectra). */
export function newestMatrixRows(sequelize: Sequelize, labId: string, studyIds: string[], leaveOut: string[] = []) {
  return selectRows<NewestMatrixRow>(sequelize, MATRICES_SQL, [labId, studyIds, leaveOut]);
}
