import { Op } from 'sequelize';
import {
  analyseTemperatureSeries,
  diffusionRateConstant,
  EngineError,
  getSolvent,
  SOLVENTS,
  viscosityAt,
} from '@shared/engine';
import type { StudyStatus } from '@shared/schemas/studies';
import type { Estimate } from '@shared/schemas/study-fits';
import type { TemperatureSeriesAnalysis, TemperatureSeriesList } from '@shared/schemas/temperature-series';
import { AppError } from '../../lib/app-error';
import type { LabContext } from '../../domain/lab-context';
import { Compound, Study, StudyFit } from '../../models';

const solventKey = (study: Study): string => study.solventId ?? study.customSolventName ?? 'unknown';
const solventName = (key: string): string =>
  Object.hasOwn(SOLVENTS, key) ? SOLVENTS[key as keyof typeof SOLVENTS].name : key;

/**
 * The lab's current studies grouped by emitter, quencher and solvent, where a group spans at
 * least two temperatures: candidate temperature series, newest pairs first.
 */
export async function listTemperatureSeries(lab: LabContext): Promise<TemperatureSeriesList> {
  const studies = await Study.findAll({
    where: { labId: lab.id, isCurrent: true },
    attributes: ['id', 'emitterId', 'quencherId', 'solventId', 'customSolventName', 'temperature', 'kSv', 'updatedAt'],
    include: [
      { model: Compound, as: 'emitter', attributes: ['id', 'name'] },
      { model: Compound, as: 'quencher', attributes: ['id', 'name'] },
    ],
    order: [['updatedAt', 'DESC']],
    limit: 5000,
  });
  const groups = new Map<string, Study[]>();
  for (const study of studies) {
    const key = `${study.emitterId}|${study.quencherId}|${solventKey(study)}`;
    groups.set(key, [...(groups.get(key) ?? []), study]);
  }
  const items = [...groups.values()]
    .map((members) => {
      const first = members[0]!;
      const temperatures = [...new Set(members.map((s) => s.temperature))].sort((a, b) => a - b);
      const fitted = new Set(members.filter((s) => s.kSv !== null && s.kSv > 0).map((s) => s.temperature));
      return {
        emitter: { id: first.emitter!.id, name: first.emitter!.name },
        quencher: { id: first.quencher!.id, name: first.quencher!.name },
        solvent: solventKey(first),
        solventName: solventName(solventKey(first)),
        studyIds: [...members].sort((a, b) => a.temperature - b.temperature).map((s) => s.id),
        temperatures,
        ready: fitted.size >= 3,
      };
    })
    .filter((group) => group.temperatures.length >= 2);
  return { items };
}

/** One study of a series with what the analysis reads: its stored K_SV and kq, and its newest fit's parameters. */
export interface SeriesMember {
  id: string;
  title: string;
  status: StudyStatus;
  temperature: number;
  solventId: string | null;
  customViscosity: number | null;
  kSv: number | null;
  kq: number | null;
  /** the newest fit's parameters by name (kSv, kq, ...), null when the study has no fit */
  parameters: Record<string, Estimate> | null;
}

type SeriesFindings = Omit<TemperatureSeriesAnalysis, 'emitter' | 'quencher' | 'solvent' | 'solventName'>;

function estimateOf(
  parameters: Record<string, Estimate> | null,
  name: string,
  fallback: number | null,
): Estimate | null {
  const stored = parameters?.[name];
  if (stored) return { value: stored.value, standardError: stored.standardError, interval95: stored.interval95 };
  if (fallback === null) return null;
  return { value: fallback, standardError: 0, interval95: { lower: fallback, upper: fallback } };
}

/** eta at the study's temperature: the entered value, else the solvent's correlation. */
function viscosityFor(study: SeriesMember, notes: string[]): { value: number; source: string } {
  if (study.customViscosity !== null) {
    return { value: study.customViscosity, source: `entered with the study, taken as at ${study.temperature} K` };
  }
  const correlation = study.solventId ? getSolvent(study.solventId).viscosityCorrelation : null;
  if (!correlation) {
    throw new AppError(
      'series_viscosity_missing',
      `Study "${study.title}" has no viscosity: enter the viscosity of its solvent at ${study.temperature} K.`,
      400,
    );
  }
  const eta = viscosityAt(correlation, study.temperature);
  if (eta.warning) notes.push(`${study.title}: ${eta.warning}.`);
  return { value: eta.value, source: getSolvent(study.solventId!).viscositySource };
}

/**
 * Analyses the chosen studies as one temperature series (engine analyseTemperatureSeries):
 * they must be of this lab, of one emitter–quencher pair in one solvent, fitted, and span at
 * least three temperatures; each refusal names the problem.
 */
export async function analyseSeries(lab: LabContext, studyIds: string[]): Promise<TemperatureSeriesAnalysis> {
  const ids = [...new Set(studyIds)];
  const studies = await Study.findAll({
    where: { labId: lab.id, id: { [Op.in]: ids } },
    include: [
      { model: Compound, as: 'emitter', attributes: ['id', 'name'] },
      { model: Compound, as: 'quencher', attributes: ['id', 'name'] },
    ],
  });
  const missing = ids.filter((id) => !studies.some((study) => study.id === id));
  if (missing.length > 0) {
    throw new AppError('not_found', `No study with id ${missing.join(', ')} in this lab.`, 404);
  }
  const pairs = new Set(studies.map((s) => `${s.emitter!.name} with ${s.quencher!.name}`));
  if (pairs.size > 1) {
    throw new AppError(
      'series_mixed_pairs',
      `A temperature series is one emitter–quencher pair; these studies hold ${[...pairs].join('; ')}.`,
      400,
    );
  }
  const solvents = new Set(studies.map((s) => solventName(solventKey(s))));
  if (solvents.size > 1) {
    throw new AppError(
      'series_mixed_solvents',
      `A temperature series is one solvent; these studies are in ${[...solvents].join(', ')}.`,
      400,
    );
  }
  const fits = await StudyFit.findAll({
    where: { id: studies.map((s) => s.latestFitId).filter((id): id is string => id !== null) },
  });
  const first = studies[0]!;
  return {
    emitter: { id: first.emitter!.id, name: first.emitter!.name },
    quencher: { id: first.quencher!.id, name: first.quencher!.name },
    solvent: solventKey(first),
    solventName: solventName(solventKey(first)),
    ...analyseSeriesMembers(
      studies.map((study) => ({
        id: study.id,
        title: study.title,
        status: study.status,
        temperature: study.temperature,
        solventId: study.solventId,
        customViscosity: study.customViscosity,
        kSv: study.kSv,
        kq: study.kq,
        parameters: fits.find((fit) => fit.id === study.latestFitId)?.result.parameters ?? null,
      })),
    ),
  };
}

/**
 * The analysis of studies already known to be one pair in one solvent (engine
 * analyseTemperatureSeries): refused with a reason when one has no fitted K_SV, when they span
 * fewer than three temperatures or when a viscosity is missing. Reads nothing.
 */
export function analyseSeriesMembers(studies: SeriesMember[]): SeriesFindings {
  const unfitted = studies.filter((s) => s.kSv === null || s.kSv <= 0);
  if (unfitted.length > 0) {
    throw new AppError(
      'series_unfitted',
      `These studies have no fitted K_SV yet: ${unfitted.map((s) => `"${s.title}"`).join(', ')}.`,
      400,
    );
  }
  const distinct = new Set(studies.map((s) => s.temperature)).size;
  if (distinct < 3) {
    throw new AppError(
      'series_too_few_temperatures',
      `A temperature series needs at least 3 different temperatures; these studies span ${distinct}.`,
      400,
    );
  }
  const notes: string[] = [];
  const points = [...studies]
    .sort((a, b) => a.temperature - b.temperature)
    .map((study) => ({
      study,
      kSv: estimateOf(study.parameters, 'kSv', study.kSv)!,
      kq: estimateOf(study.parameters, 'kq', study.kq),
      viscosity: viscosityFor(study, notes),
    }));
  if (points.some((p) => p.kq === null)) notes.push('Studies without tau0 have no kq; give tau0 at each temperature.');
  try {
    const analysis = analyseTemperatureSeries(
      points.map((p) => ({
        temperature: p.study.temperature,
        kSv: p.kSv.value,
        kSvStandardError: p.kSv.standardError,
        viscosity: p.viscosity.value,
        kq: p.kq?.value ?? null,
      })),
    );
    return {
      points: points.map((p) => ({
        studyId: p.study.id,
        title: p.study.title,
        status: p.study.status,
        temperature: p.study.temperature,
        kSv: p.kSv,
        kq: p.kq,
        viscosity: p.viscosity.value,
        viscositySource: p.viscosity.source,
        temperatureOverViscosity: p.study.temperature / p.viscosity.value,
        diffusionLimit: diffusionRateConstant(p.viscosity.value, p.study.temperature),
      })),
      verdict: analysis.verdict,
      reasons: analysis.reasons,
      kSvActivationEnergy: analysis.kSvActivationEnergy,
      diffusionActivationEnergy: analysis.diffusionActivationEnergy,
      viscousFlowActivationEnergy: analysis.viscousFlowActivationEnergy,
      stepRatio: analysis.stepRatio,
      arrhenius: analysis.activation
        ? {
            activationEnergy: analysis.activation.activationEnergy,
            lnPreExponentialFactor: analysis.activation.lnPreExponentialFactor,
          }
        : null,
      eyring: analysis.activation
        ? {
            activationEnthalpy: analysis.activation.activationEnthalpy,
            activationEntropy: analysis.activation.activationEntropy,
          }
        : null,
      notes: analysis.activationNote ? [...notes, analysis.activationNote] : notes,
    };
  } catch (error) {
    if (error instanceof EngineError) throw new AppError('series_not_analysable', error.message, 400);
    throw error;
  }
}
