import type { FitResult } from '../../schemas/study-fits';
import { EngineError } from '../core/engine-error';
import type { QualityFlag } from '../flags/quality-flag';
import { diffusionRateConstant, solventDiffusionLimitAt } from '../kinetics/diffusion-rate-constant';
import { quenchingRateConstant } from '../kinetics/quenching-rate-constant';
import type { ParameterEstimate } from '../stats/parameter-estimate';
import { studentTQuantile975 } from '../stats/student-t';

export interface KineticsSettings {
  solventId: string | null;
  customSolventName: string | null;
  customViscosity: number | null;
  temperature: number;
  tau0: number | null;
  tau0Uncertainty: number | null;
  tau0LifetimeId: string | null;
}

/**
 * Diffusion limit k_diff = 8RT/(3 eta) for the study at its own temperature: the entered
 * viscosity when there is one (a single value, taken as measured at the study's temperature),
 * else eta(T) from the solvent's handbook correlation, with a note outside its valid range.
 */
export function diffusionLimitFor(
  settings: KineticsSettings,
  notes: string[],
): { value: number; basis: string } | null {
  if (settings.customViscosity !== null) {
    const value = diffusionRateConstant(settings.customViscosity, settings.temperature);
    return {
      value,
      basis: `entered viscosity ${settings.customViscosity} Pa s, taken as measured at ${settings.temperature} K`,
    };
  }
  if (!settings.solventId) return null;
  try {
    const limit = solventDiffusionLimitAt(settings.solventId, settings.temperature);
    if (limit.warning) notes.push(`Diffusion limit: ${limit.warning}.`);
    return { value: limit.value, basis: limit.basis };
  } catch (error) {
    if (error instanceof EngineError) {
      notes.push(`No diffusion limit: ${error.message}`);
      return null;
    }
    throw error;
  }
}

/** kq = K / tau0 through the engine, with its 95 % interval from the K fit's degrees of freedom. */
export function rateConstant(
  k: ParameterEstimate,
  degreesOfFreedom: number,
  tau0: { value: number; standardError: number },
  limit: { value: number } | null,
): { kq: ParameterEstimate; ratio: number | null; flags: QualityFlag[] } {
  const result = quenchingRateConstant({
    kSv: k.value,
    kSvStandardError: k.standardError,
    tau0: tau0.value,
    tau0StandardError: tau0.standardError,
    ...(limit ? { diffusionLimit: limit.value } : {}),
  });
  const half = studentTQuantile975(degreesOfFreedom) * result.standardError;
  return {
    kq: {
      value: result.value,
      standardError: result.standardError,
      interval95: { lower: result.value - half, upper: result.value + half },
    },
    ratio: result.fractionOfDiffusionLimit,
    flags: result.flags,
  };
}

/** The tau0 used for kq: entered (or from a lifetime record), else from the lifetime series' blanks. */
export function tau0For(
  settings: KineticsSettings,
  lifetimeTau0: { value: number; relativeStandardError: number | null } | null,
): FitResult['tau0'] {
  if (settings.tau0 !== null) {
    return {
      value: settings.tau0,
      standardError: settings.tau0Uncertainty ?? 0,
      kind: settings.tau0LifetimeId ? 'lifetime-record' : 'entered',
      source: settings.tau0LifetimeId ? 'lifetime record of the emitter' : 'entered with the study',
    };
  }
  if (lifetimeTau0) {
    return {
      value: lifetimeTau0.value,
      standardError: lifetimeTau0.value * (lifetimeTau0.relativeStandardError ?? 0),
      kind: 'lifetime-series',
      source: 'lifetime series at zero quencher',
    };
  }
  return null;
}
