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
  settings: Pick<KineticsSettings, 'solventId' | 'customViscosity' | 'temperature'>,
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
  tau0: { value: number; standardError: number | null },
  limit: { value: number } | null,
): { kq: ParameterEstimate; ratio: number | null; flags: QualityFlag[] } {
  const result = quenchingRateConstant({
    kSv: k.value,
    kSvStandardError: k.standardError,
    tau0: tau0.value,
    tau0StandardError: tau0.standardError ?? 0,
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

/**
 * The tau0 used for kq: entered (or from a lifetime record), else from the lifetime series' blanks.
 * Its standard error is null, and its source says "without uncertainty", when none is known (typed
 * without one, a record without one, or a single lifetime blank): it is then not silently exact.
 */
export function tau0For(
  settings: KineticsSettings,
  lifetimeTau0: { value: number; relativeStandardError: number | null; replicates: number } | null,
): FitResult['tau0'] {
  const without = ', without uncertainty';
  if (settings.tau0 !== null) {
    const standardError = settings.tau0Uncertainty ?? null;
    const source = settings.tau0LifetimeId ? 'lifetime record of the emitter' : 'entered with the study';
    return {
      value: settings.tau0,
      standardError,
      kind: settings.tau0LifetimeId ? 'lifetime-record' : 'entered',
      source: standardError === null ? `${source}${without}` : source,
    };
  }
  if (lifetimeTau0) {
    const relative = lifetimeTau0.relativeStandardError;
    const blanks = `${lifetimeTau0.replicates} lifetime blank${lifetimeTau0.replicates === 1 ? '' : 's'}`;
    return {
      value: lifetimeTau0.value,
      standardError: relative === null ? null : lifetimeTau0.value * relative,
      kind: 'lifetime-series',
      source: relative === null ? `${blanks} at zero quencher${without}` : `mean of ${blanks} at zero quencher`,
    };
  }
  return null;
}

/** "50 ns", "1.2 µs": a time for the notes on standard errors (three figures). */
const time = (seconds: number) =>
  seconds < 1e-6 ? `${Number((seconds * 1e9).toPrecision(3))} ns` : `${Number((seconds * 1e6).toPrecision(3))} µs`;

/** What the standard error of kq = K / tau0 includes, in words, for the result and the screen. */
export function kqIncludes(kIncludes: string, tau0: NonNullable<FitResult['tau0']>): string {
  if (tau0.standardError === null || tau0.standardError === 0)
    return `${kIncludes}; τ0 without uncertainty, so this covers K only`;
  const from =
    tau0.kind === 'lifetime-record'
      ? 'τ0 from a lifetime record'
      : tau0.kind === 'entered'
        ? 'τ0 as entered'
        : 'τ0 from the lifetime blanks';
  return `${kIncludes}; ${from} (SE ${time(tau0.standardError)})`;
}
