import type { FitModel } from '../schemas/studies';
import type { Estimate, FitResult } from '../schemas/study-fits';
import { formatEstimate } from './format-estimate';
import { formatNumber } from './format-number';
import { UNITS } from './quantity-units';
import { toNanoseconds } from '../units/units';

/** One fitted parameter as people read it: the same label, unit and numbers on screen, in CSV and PDF. */
export interface ParameterLine {
  /** the parameter's name in the stored result (kSv, kD, sum, accessibleFraction, ...) */
  key: string;
  label: string;
  unit: string;
  estimate: Estimate;
  /** true for the model's main constants, shown at the top of the study screen */
  headline: boolean;
}

type Known = Omit<ParameterLine, 'estimate'>;

const line = (key: string, label: string, unit: string, headline = false): Known => ({ key, label, unit, headline });

const RATE: Known[] = [
  line('kq', 'kq', UNITS.perMolarPerSecond),
  line('kqFromLifetimes', 'kq from lifetimes', UNITS.perMolarPerSecond),
];

/**
 * The parameters of a stored fit in reading order, labelled for its model: K_SV and the intercept
 * for a straight line; K_D and K_S when the combined static + dynamic fit could tell its two roots
 * apart (a lifetime series, or the diffusion bound k_diff τ0 on K_D), else their sum, product and
 * both roots unassigned; K of the accessible part and f_a for the modified plot. `note` says how the
 * combined fit's roots were assigned (null for other models).
 */
export function fitParameterLines(
  model: FitModel,
  result: Pick<FitResult, 'parameters' | 'lifetime'> & Partial<Pick<FitResult, 'intensity'>>,
): { lines: ParameterLine[]; note: string | null } {
  const p = result.parameters;
  let known: Known[];
  let note: string | null = null;
  if (model === 'static-dynamic') {
    const sumAndProduct = [
      line('sum', 'K_D + K_S', UNITS.perMolar),
      line('product', 'K_D × K_S', UNITS.perMolarSquared),
    ];
    if (p.kD && p.kS) {
      known = [line('kD', 'K_D (dynamic)', UNITS.perMolar, true), line('kS', 'K_S (static)', UNITS.perMolar, true)];
      known.push(...sumAndProduct);
      note = result.lifetime
        ? 'K_D is the root nearer the slope of the lifetime plot τ0/τ, which sees dynamic quenching only.'
        : 'K_D is the root below the diffusion bound k_diff τ0; the other root is above it, so it is K_S.';
    } else {
      known = sumAndProduct.map((entry) => ({ ...entry, headline: true }));
      known.push(
        line('largerRoot', 'Larger root (K_D or K_S)', UNITS.perMolar),
        line('smallerRoot', 'Smaller root (K_D or K_S)', UNITS.perMolar),
      );
      note =
        'Intensities alone cannot tell K_D from K_S: either root fits equally well. A lifetime series (K_D is the root nearer its slope) or a τ0 with a diffusion limit decides.';
    }
  } else if (model === 'modified') {
    known = [
      line('kSv', 'K (accessible part)', UNITS.perMolar, true),
      line('accessibleFraction', 'f_a (accessible fraction)', '', true),
    ];
  } else {
    known = [line('kSv', 'K_SV', UNITS.perMolar, true), line('intercept', 'Intercept', '')];
  }
  if (result.intensity === 'no-intensity-data') {
    // Lifetimes only: whatever the model, the line τ0/τ was fitted (shared/engine/study-fit/lifetime-only.ts).
    known = [line('kSv', 'K_SV from lifetimes (τ0/τ)', UNITS.perMolar, true), line('intercept', 'Intercept', '')];
    note = 'No intensity data: the lifetime Stern–Volmer line sees dynamic quenching only.';
  }
  const lines = [...known, ...RATE].flatMap((entry) => {
    const estimate = p[entry.key];
    return estimate ? [{ ...entry, estimate }] : [];
  });
  return { lines, note };
}

/**
 * The R² values of a stored fit, labelled: a line through 1 reports its uncentred R² (about 1 even
 * for a poor line, so labelled as such) and the centred R² of the same line beside it; other fits
 * their centred R². Values to four decimals, as on screen, in the PDF and the CSV.
 */
export function rSquaredLines(
  statistics: Pick<FitResult['statistics'], 'rSquared' | 'rSquaredDefinition' | 'rSquaredCentred'>,
): Array<{ key: 'r_squared' | 'r_squared_uncentred' | 'r_squared_centred'; label: string; value: number }> {
  const { rSquared, rSquaredDefinition, rSquaredCentred } = statistics;
  if (rSquared === null) return [];
  if (rSquaredDefinition !== 'uncentred') return [{ key: 'r_squared', label: 'R²', value: rSquared }];
  return [
    { key: 'r_squared_uncentred', label: 'R² about 1 (uncentred)', value: rSquared },
    ...(rSquaredCentred === null || rSquaredCentred === undefined
      ? []
      : [{ key: 'r_squared_centred' as const, label: 'centred R² of the same line', value: rSquaredCentred }]),
  ];
}

/** τ0 as used for kq, in words: "1.00 ± 0.05 µs (lifetime record of the emitter)" or "... without uncertainty". */
export function tau0Text(tau0: NonNullable<FitResult['tau0']>): string {
  const ns = tau0.standardError === null ? null : toNanoseconds(tau0.standardError);
  return `${formatEstimate(toNanoseconds(tau0.value), ns, UNITS.nanosecond)} (${tau0.source})`;
}

/**
 * Which weighting gave the reported constants, in words: the same on screen, in the CSV and the PDF.
 * A fit stored before the weighting was a choice has none recorded.
 */
export function weightingText(weighting: FitResult['weighting']): string {
  if (!weighting) return 'not recorded (fitted before the weighting was a choice)';
  const points = `${weighting.pointsWeighted} points`;
  if (weighting.applied === 'point-uncertainties')
    return `weighted least squares, w = 1/σ² from the readings’ own uncertainties (${points})`;
  if (weighting.applied === 'replicate-scatter')
    return `weighted least squares, w = 1/σ² from the replicate scatter at each [Q] (${points})`;
  return weighting.chosen === 'weighted'
    ? `unweighted least squares (weighted chosen, but ${weighting.reason ?? 'the points give no weights'})`
    : 'unweighted least squares';
}

type Replicates = NonNullable<FitResult['replicates']>;

/** The pooled runs in words: "2 runs, each divided by its own I0: run 1 1000, run 2 800". */
export function replicateRunsText(replicates: Replicates): string {
  const runs = replicates.runs.map((run) => `run ${run.series} ${formatNumber(run.value)}`);
  return `${replicates.runs.length} runs, each divided by its own I0: ${runs.join(', ')}`;
}

/** The weighted fit of pooled runs beside the unweighted one, and whether weighting moves K_SV beyond its SE. */
export function weightingComparisonText(weighting: NonNullable<Replicates['weighting']>): string {
  const source = weighting.source === 'point-uncertainties' ? 'readings’ uncertainties' : 'replicate scatter';
  const estimate = (value: Estimate) => formatEstimate(value.value, value.standardError, UNITS.perMolar);
  return `Weighted by the ${source} (Bevington & Robinson, ch. 6): K_SV = ${estimate(weighting.weighted)}; unweighted ${estimate(weighting.unweighted)}. Weighting moves K_SV by ${weighting.beyondStandardError ? 'more' : 'less'} than its standard error.`;
}
