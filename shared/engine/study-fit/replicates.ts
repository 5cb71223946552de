import { EngineError } from '../core/engine-error';
import { fitSternVolmer, type SternVolmerFit } from '../stern-volmer/fit-stern-volmer';
import type { InterceptMode } from '../stern-volmer/diagnose-curvature';
import { referenceFromBlanks } from '../stern-volmer/reference-from-blanks';

/** One reading of a replicate titration: its series, [Q] (mol/L), intensity and optional 1-sigma. */
export interface ReplicateReading {
  series: number;
  concentration: number;
  intensity: number;
  uncertainty: number | null;
}

export interface PooledRatio {
  series: number;
  concentration: number;
  /** I0/I with the series' own I0 */
  ratio: number;
  /** propagated 1-sigma of the ratio, or null when nothing gives one */
  sigma: number | null;
}

export interface PooledReplicates {
  /** each series' I0: the mean of its blanks (or the given I0), with the standard error of that mean */
  i0: Array<{ series: number; value: number; standardError: number | null; blanks: number }>;
  ratios: PooledRatio[];
  /** per concentration: how many readings, the mean I0/I and its sample standard deviation (null for one reading) */
  summary: Array<{ concentration: number; n: number; mean: number; sd: number | null }>;
  /** where the weights come from: every reading's own uncertainty, else the scatter of the replicates */
  weightSource: 'point-uncertainties' | 'replicate-scatter' | null;
}

const sampleSd = (values: readonly number[]) => {
  const mean = values.reduce((sum, value) => sum + value, 0) / values.length;
  return Math.sqrt(values.reduce((sum, value) => sum + (value - mean) ** 2, 0) / (values.length - 1));
};

/**
 * Pools several titration series of one pair: each series is normalised by its own I0 (the mean
 * of its blanks, else the given I0), so lamp drift between runs does not enter K_SV; then the
 * readings at each concentration are summarised as mean ± sample SD.
 *
 * Uncertainty of each ratio r = I0/I by first-order propagation for a quotient,
 * σ_r = r √((σ_I/I)² + (σ_I0/I0)²), with σ_I0 the standard error of the series' blank mean
 * (Bevington & Robinson, Data Reduction and Error Analysis for the Physical Sciences, 3rd ed.,
 * 2003, ch. 3, eq. 3.14). When not every reading has its own σ_I, the weights come from the
 * replicate scatter instead: σ_r = the sample SD of the ratios at that concentration (at least
 * two readings that differ). The correlation the shared I0 puts between the points of one series
 * is ignored in the weights (common practice).
 *
 * The ratios come back in the readings' order.
 *
 * @throws EngineError MISSING_I0 (a series without blanks and no I0 given), NON_POSITIVE_VALUE
 * @example poolReplicates([{ series: 1, concentration: 0, intensity: 1000, uncertainty: null }, …]).summary
 */
export function poolReplicates(readings: readonly ReplicateReading[], given?: { i0?: number }): PooledReplicates {
  const seriesIds = [...new Set(readings.map((reading) => reading.series))].sort((a, b) => a - b);
  const i0: PooledReplicates['i0'] = [];
  const ratios: PooledRatio[] = [];
  const everySigma = readings.every((reading) => reading.uncertainty !== null);
  const i0BySeries = new Map<number, PooledReplicates['i0'][number]>();
  for (const series of seriesIds) {
    const own = readings.filter((reading) => reading.series === series);
    for (const reading of own)
      if (!(reading.intensity > 0))
        throw new EngineError('NON_POSITIVE_VALUE', 'intensities', `series ${series} has an intensity ≤ 0`);
    const blanks = own.filter((reading) => reading.concentration === 0);
    if (blanks.length === 0 && given?.i0 === undefined)
      throw new EngineError(
        'MISSING_I0',
        'i0',
        `series ${series} has no point at zero quencher concentration and no I0 was given`,
        'Measure a blank in every series, or enter I0',
      );
    const reference = referenceFromBlanks(
      own.map((reading) => reading.concentration),
      own.map((reading) => reading.intensity),
      blanks.length > 0 ? undefined : given?.i0,
      { field: 'i0', code: 'MISSING_I0' },
    );
    // SE of the blank mean: from the blanks' scatter (≥ 2), else from their own σ (√Σσ² / n), else unknown.
    const standardError =
      reference.relativeStandardError !== null
        ? reference.relativeStandardError * reference.value
        : blanks.length > 0 && blanks.every((blank) => blank.uncertainty !== null)
          ? Math.sqrt(blanks.reduce((sum, blank) => sum + blank.uncertainty! ** 2, 0)) / blanks.length
          : null;
    const entry = { series, value: reference.value, standardError, blanks: reference.replicates };
    i0.push(entry);
    i0BySeries.set(series, entry);
  }
  // In the readings' own order, so a caller can line the ratios up with its points.
  for (const reading of readings) {
    const reference = i0BySeries.get(reading.series)!;
    const ratio = reference.value / reading.intensity;
    const sigma = everySigma
      ? ratio *
        Math.sqrt(
          (reading.uncertainty! / reading.intensity) ** 2 + ((reference.standardError ?? 0) / reference.value) ** 2,
        )
      : null;
    ratios.push({ series: reading.series, concentration: reading.concentration, ratio, sigma });
  }
  const concentrations = [...new Set(ratios.map((entry) => entry.concentration))].sort((a, b) => a - b);
  const summary = concentrations.map((concentration) => {
    const here = ratios.filter((entry) => entry.concentration === concentration).map((entry) => entry.ratio);
    return {
      concentration,
      n: here.length,
      mean: here.reduce((sum, value) => sum + value, 0) / here.length,
      sd: here.length > 1 ? sampleSd(here) : null,
    };
  });
  let weightSource: PooledReplicates['weightSource'] = everySigma ? 'point-uncertainties' : null;
  if (!everySigma) {
    const scatter = new Map(summary.map((entry) => [entry.concentration, entry.sd]));
    const quenched = ratios.filter((entry) => entry.concentration > 0);
    if (quenched.length > 0 && quenched.every((entry) => (scatter.get(entry.concentration) ?? 0) > 0)) {
      weightSource = 'replicate-scatter';
      for (const entry of quenched) entry.sigma = scatter.get(entry.concentration)!;
    }
  }
  return { i0, ratios, summary, weightSource };
}

export interface WeightingComparison {
  weighted: SternVolmerFit;
  unweighted: SternVolmerFit;
  /** K_SV(weighted) − K_SV(unweighted), M⁻¹ */
  shift: number;
  /** true when |shift| is larger than the unweighted K_SV's standard error */
  beyondStandardError: boolean;
  /** blanks without a σ of their own (they set I0 of their series) are left out of the weighted fit */
  pointsWeighted: number;
}

/**
 * Weighted least squares on the pooled ratios, w = 1/σ_r², beside the unweighted fit of the same
 * points, through the engine's one straight-line path (fitSternVolmer → fitLine). The weighted
 * slope and intercept are Bevington & Robinson's closed form (3rd ed., ch. 6, eqs. 6.12):
 * Δ = ΣwΣwx² − (Σwx)², b = (ΣwΣwxy − ΣwxΣwy)/Δ, a = (Σwx²Σwy − ΣwxΣwxy)/Δ; their absolute
 * variances σ_b² = Σw/Δ are scaled here by χ²/ν (weights taken as relative), as fitLine does.
 * Readings whose ratio has no σ (a blank that defines its own series' I0, ratio 1 by construction)
 * are left out of both fits, so the two compare like with like.
 *
 * @throws EngineError MODEL_NOT_APPLICABLE when the readings give no weights; those of fitSternVolmer
 */
export function compareWeighting(pooled: PooledReplicates, intercept: InterceptMode = 'free'): WeightingComparison {
  const weighted = pooled.ratios.filter((entry) => entry.sigma !== null && entry.sigma > 0);
  if (pooled.weightSource === null || weighted.length === 0) {
    throw new EngineError(
      'MODEL_NOT_APPLICABLE',
      'uncertainty',
      'a weighted fit needs an uncertainty for every reading, or at least two differing replicates at every concentration',
      'Enter each reading’s 1-sigma, or measure each concentration in two or more series',
    );
  }
  const concentrations = weighted.map((entry) => entry.concentration);
  const ratios = weighted.map((entry) => entry.ratio);
  const withWeights = fitSternVolmer({
    concentrations,
    ratios,
    ratioUncertainties: weighted.map((entry) => entry.sigma!),
    intercept,
  });
  const without = fitSternVolmer({ concentrations, ratios, intercept });
  const shift = withWeights.kSv.value - without.kSv.value;
  return {
    weighted: withWeights,
    unweighted: without,
    shift,
    beyondStandardError: Math.abs(shift) > without.kSv.standardError,
    pointsWeighted: weighted.length,
  };
}
