import { EngineError } from '../core/engine-error';
import type { QualityFlag } from '../flags/quality-flag';
import { kqFromLifetimes, type KqFromLifetimes } from '../kinetics/kq-from-lifetimes';
import type { InterceptMode } from '../stern-volmer/diagnose-curvature';
import { compareStaticDynamic } from '../stern-volmer/compare-static-dynamic';
import { fitLifetimeSternVolmer, type LifetimeSternVolmerFit } from '../stern-volmer/fit-lifetime-stern-volmer';
import type { SternVolmerFit } from '../stern-volmer/fit-stern-volmer';

interface LifetimePoint {
  concentration: number;
  lifetime: number | null;
}

export interface LifetimeAnalysis {
  fit: LifetimeSternVolmerFit;
  tau0: { value: number; relativeStandardError: number | null; replicates: number };
  /** the intercept treatment, the same as the intensity line it is compared with */
  intercept: InterceptMode;
  /** kq as the slope of 1/tau against [Q] (tau0 does not enter); null when it cannot be fitted */
  kq: KqFromLifetimes | null;
  points: Array<{ x: number; y: number }>;
  verdict: string | null;
  /** compares with the intensity fit and returns the comparison's flags */
  compare: (intensityFit: SternVolmerFit) => QualityFlag[];
}

const VERDICTS = {
  dynamic: 'Intensity and lifetime slopes agree within error: dynamic quenching.',
  'static-contribution': 'The intensity plot is steeper than the lifetime plot: part of the quenching is static.',
  'lifetime-steeper': 'The lifetime plot is steeper than the intensity plot; check both data sets.',
} as const;

/**
 * tau0/tau against [Q] through the engine's fitLifetimeSternVolmer when at least three
 * points carry a lifetime; tau0 from the blanks, else the study's tau0; the intercept free or
 * fixed at 1 like the intensity line it is compared with (like with like). kq from the
 * lifetimes is the slope of 1/tau against [Q] (kqFromLifetimes). Returns null with a note when
 * the lifetimes cannot be fitted.
 */
export function lifetimeAnalysis(
  points: readonly LifetimePoint[],
  studyTau0: number | null,
  notes: string[],
  intercept: InterceptMode = 'free',
): LifetimeAnalysis | null {
  const withLifetime = points.filter((point) => point.lifetime !== null);
  if (withLifetime.length < 3) return null;
  const concentrations = withLifetime.map((point) => point.concentration);
  const lifetimes = withLifetime.map((point) => point.lifetime!);
  const hasBlank = concentrations.includes(0);
  let fit: LifetimeSternVolmerFit;
  try {
    fit = fitLifetimeSternVolmer({
      concentrations,
      lifetimes,
      ...(!hasBlank && studyTau0 !== null ? { tau0: studyTau0 } : {}),
      intercept,
    });
  } catch (error) {
    if (error instanceof EngineError) {
      notes.push(`Lifetimes not fitted: ${error.message}`);
      return null;
    }
    throw error;
  }
  const analysis: LifetimeAnalysis = {
    fit,
    tau0: {
      value: fit.tau0.value,
      relativeStandardError: fit.tau0.relativeStandardError,
      replicates: fit.tau0.replicates,
    },
    intercept,
    kq: slopeOfInverseLifetime(concentrations, lifetimes, notes),
    points: concentrations.map((x, i) => ({ x, y: fit.tau0.value / lifetimes[i]! })),
    verdict: null,
    compare(intensityFit) {
      const comparison = compareStaticDynamic(intensityFit, fit);
      analysis.verdict = VERDICTS[comparison.verdict];
      return comparison.flags;
    },
  };
  return analysis;
}

function slopeOfInverseLifetime(
  concentrations: readonly number[],
  lifetimes: readonly number[],
  notes: string[],
): KqFromLifetimes | null {
  try {
    return kqFromLifetimes({ concentrations, lifetimes });
  } catch (error) {
    if (error instanceof EngineError) {
      notes.push(`kq from lifetimes not fitted: ${error.message}`);
      return null;
    }
    throw error;
  }
}
