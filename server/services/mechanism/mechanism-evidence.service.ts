import { Op } from 'sequelize';
import {
  combineMechanismEvidence,
  type DiffusionEvidence,
  type LifetimeEvidence,
  type MechanismPieceKind,
  type TemperatureEvidence,
  type WavelengthEvidence,
} from '@shared/engine';
import type { MechanismEvidence } from '@shared/schemas/mechanism-evidence';
import type { LabContext } from '../../domain/lab-context';
import { AppError } from '../../lib/app-error';
import { SpectrumMatrix, Study, StudyFit } from '../../models';
import { loadStudy } from '../studies/study-access';
import { absorptionEvidenceForStudy } from './absorption-titrations.service';
import { analyseSeries } from './temperature-series.service';

type Missing = Partial<Record<MechanismPieceKind, string>>;

/** The lifetime line beside the intensity line (or the combined fit) of the study's stored fit. */
function lifetimeOf(fit: StudyFit): LifetimeEvidence | null {
  const { result, model } = fit;
  if (!result.lifetime) return null;
  const intercept = result.lifetime.intercept ?? 'free';
  const line = result.parameters.kSv;
  const df = result.statistics.degreesOfFreedom;
  const isLine = model === 'linear-free' || model === 'linear-fixed';
  const { kD, kS } = result.parameters;
  return {
    intensityKsv:
      isLine && line ? { value: line.value, standardError: line.standardError, degreesOfFreedom: df } : null,
    lifetimeKsv: {
      value: result.lifetime.kSv.value,
      standardError: result.lifetime.kSv.standardError,
      degreesOfFreedom: result.lifetime.points.length - (intercept === 'free' ? 2 : 1),
    },
    intercept,
    combined:
      kD && kS
        ? {
            kD: { value: kD.value, standardError: kD.standardError, degreesOfFreedom: df },
            kS: { value: kS.value, standardError: kS.standardError, degreesOfFreedom: df },
          }
        : null,
  };
}

/** kq of the stored fit against k_diff = 8RT/3eta(T) at the study's own temperature (study-fit kinetics). */
function diffusionOf(study: Study, fit: StudyFit | null, missing: Missing): DiffusionEvidence | null {
  const kq = fit?.result.parameters.kq;
  const limit = fit?.result.diffusionLimit;
  if (!kq) {
    missing.diffusion = 'Give τ0 (entered, from a lifetime record or from lifetime blanks) to turn K_SV into kq.';
    return null;
  }
  if (!limit) {
    missing.diffusion = 'Choose a solvent from the table, or enter the viscosity, for the diffusion limit.';
    return null;
  }
  return {
    kq: { value: kq.value, standardError: kq.standardError, interval95: kq.interval95 },
    diffusionLimit: limit.value,
    temperature: study.temperature,
  };
}

/**
 * The temperature series the study belongs to: the lab's current studies of the same pair in the
 * same solvent with a fitted K_SV (the study itself included); analysed once it spans 3 temperatures.
 */
async function temperatureOf(
  lab: LabContext,
  study: Study,
  missing: Missing,
): Promise<{ evidence: TemperatureEvidence | null; series: MechanismEvidence['series'] }> {
  const siblings = await Study.findAll({
    where: {
      labId: lab.id,
      emitterId: study.emitterId,
      quencherId: study.quencherId,
      solventId: study.solventId,
      customSolventName: study.customSolventName,
      [Op.or]: [{ isCurrent: true }, { id: study.id }],
    },
    attributes: ['id', 'temperature', 'kSv'],
    order: [['temperature', 'ASC']],
    limit: 40,
  });
  const fitted = siblings.filter((s) => s.kSv !== null && s.kSv > 0);
  const temperatures = [...new Set(siblings.map((s) => s.temperature))];
  const series = temperatures.length >= 2 ? { studyIds: siblings.map((s) => s.id), temperatures } : null;
  const fittedTemperatures = new Set(fitted.map((s) => s.temperature)).size;
  if (fittedTemperatures < 3) {
    missing.temperature = `The same pair in the same solvent has a fitted K_SV at ${fittedTemperatures} temperature${fittedTemperatures === 1 ? '' : 's'}; a trend needs 3 or more.`;
    return { evidence: null, series };
  }
  try {
    const analysis = await analyseSeries(
      lab,
      fitted.map((s) => s.id),
    );
    return {
      evidence: {
        verdict: analysis.verdict,
        kSvActivationEnergy: analysis.kSvActivationEnergy,
        diffusionActivationEnergy: analysis.diffusionActivationEnergy,
        temperatures: [...new Set(analysis.points.map((p) => p.temperature))],
      },
      series,
    };
  } catch (error) {
    if (!(error instanceof AppError) || error.status !== 400) throw error;
    missing.temperature = `The temperature series cannot be read: ${error.message}`;
    return { evidence: null, series };
  }
}

/** The newest spectrum matrix of the study: its K_SV homogeneity, components and flags. */
async function wavelengthOf(
  lab: LabContext,
  studyId: string,
): Promise<{ evidence: WavelengthEvidence | null; matrixId: string | null }> {
  const matrix = await SpectrumMatrix.findOne({
    where: { labId: lab.id, studyId },
    attributes: ['id', 'analysis'],
    order: [['createdAt', 'DESC']],
  });
  if (!matrix) return { evidence: null, matrixId: null };
  const { analysis } = matrix;
  return {
    evidence: {
      flags: analysis.flags.map((flag) => flag.code),
      homogeneity: analysis.homogeneity,
      significantComponents: analysis.components.significant,
      bandWidth: analysis.bandWidth,
    },
    matrixId: matrix.id,
  };
}

/**
 * The mechanism evidence of a study (engine combineMechanismEvidence): what each piece that exists
 * says, the combined verdict with reasons, the missing pieces with what to add. Reads only: the
 * stored fit, the study's newest spectrum matrix and absorption titration, and the series of the same pair in the same solvent.
 */
export async function mechanismEvidence(lab: LabContext, studyId: string): Promise<MechanismEvidence> {
  const study = await loadStudy(lab, studyId);
  const fit = study.latestFitId ? await StudyFit.findOne({ where: { id: study.latestFitId, studyId } }) : null;
  const missing: Missing = {};
  if (!fit) missing.lifetime = 'Fit the study first; then add lifetimes at each [Q] to compare τ0/τ with I0/I.';
  const [temperature, wavelength, absorption] = await Promise.all([
    temperatureOf(lab, study, missing),
    wavelengthOf(lab, studyId),
    absorptionEvidenceForStudy(lab, studyId),
  ]);
  const assessment = combineMechanismEvidence({
    lifetime: fit ? lifetimeOf(fit) : null,
    temperature: temperature.evidence,
    wavelength: wavelength.evidence,
    absorption,
    diffusion: diffusionOf(study, fit, missing),
    missingBecause: missing,
  });
  return {
    studyId,
    ...assessment,
    series: temperature.series,
    spectrumMatrixId: wavelength.matrixId,
  };
}
