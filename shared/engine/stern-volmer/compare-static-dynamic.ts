import { qualityFlag, type QualityFlag } from '../flags/quality-flag';
import { formatNumber, UNITS } from '../../format';
import { fitLineThroughOrigin } from '../stats/fit-line-through-origin';
import { makeEstimate, type ParameterEstimate } from '../stats/parameter-estimate';
import { studentTQuantile975 } from '../stats/student-t';
import type { SternVolmerFit } from './fit-stern-volmer';

export interface StaticDynamicComparison {
  /** 'dynamic': slopes equal within error; 'static-contribution': intensity slope steeper */
  verdict: 'dynamic' | 'static-contribution' | 'lifetime-steeper';
  /** K_SV(intensity) - K_SV(lifetime), M^-1, interval with Welch–Satterthwaite df */
  slopeDifference: ParameterEstimate;
  welchDegreesOfFreedom: number;
  /** K_S from (I0/I)/(tau0/tau) = 1 + K_S[Q] on concentrations present in both series; null with fewer than 3 shared */
  staticConstant: ParameterEstimate | null;
  flags: QualityFlag[];
}

/**
 * Static or dynamic quenching from intensity and lifetime Stern–Volmer slopes (Lakowicz,
 * Principles of Fluorescence Spectroscopy, 3rd ed., ch. 8). Purely dynamic quenching
 * gives equal slopes; a steeper intensity plot means an added static part. The slopes
 * count as equal when their difference lies within t(0.975, df) times its standard
 * error sqrt(SE_I^2 + SE_tau^2), df from Welch–Satterthwaite. K_S comes from the ratio
 * (I0/I)/(tau0/tau) = 1 + K_S[Q], fitted through 1, using the mean ratios at each
 * concentration measured in both series.
 *
 * @param intensityFit - fitSternVolmer result on I0/I (same intercept mode as the other)
 * @param lifetimeFit - fitSternVolmer result on tau0/tau
 * @throws EngineError from the K_S fit only on invalid numbers (inputs are fit results)
 * @example compareStaticDynamic(intensityFit, lifetimeFit).verdict // 'dynamic'
 */
export function compareStaticDynamic(
  intensityFit: SternVolmerFit,
  lifetimeFit: SternVolmerFit,
): StaticDynamicComparison {
  const a = intensityFit.kSv;
  const b = lifetimeFit.kSv;
  const difference = a.value - b.value;
  const varianceA = a.standardError ** 2;
  const varianceB = b.standardError ** 2;
  const standardError = Math.sqrt(varianceA + varianceB);
  const welchDenominator =
    (varianceA * varianceA) / intensityFit.degreesOfFreedom + (varianceB * varianceB) / lifetimeFit.degreesOfFreedom;
  const welchDegreesOfFreedom =
    welchDenominator > 0
      ? (varianceA + varianceB) ** 2 / welchDenominator
      : intensityFit.degreesOfFreedom + lifetimeFit.degreesOfFreedom;
  const halfWidth = studentTQuantile975(welchDegreesOfFreedom) * standardError;
  const verdict =
    Math.abs(difference) <= halfWidth ? 'dynamic' : difference > 0 ? 'static-contribution' : 'lifetime-steeper';
  const flags: QualityFlag[] =
    verdict === 'lifetime-steeper'
      ? [
          qualityFlag(
            'LIFETIME_STEEPER_THAN_INTENSITY',
            `K_SV ${formatNumber(a.value)} (intensity) vs ${formatNumber(b.value)} (lifetime) ${UNITS.perMolar}`,
          ),
        ]
      : [];
  return {
    verdict,
    slopeDifference: {
      value: difference,
      standardError,
      interval95: { lower: difference - halfWidth, upper: difference + halfWidth },
    },
    welchDegreesOfFreedom,
    staticConstant: staticConstantFromPairs(intensityFit.points, lifetimeFit.points),
    flags,
  };
}

function staticConstantFromPairs(
  intensity: SternVolmerFit['points'],
  lifetime: SternVolmerFit['points'],
): ParameterEstimate | null {
  const intensityMeans = meanByConcentration(intensity);
  const lifetimeMeans = meanByConcentration(lifetime);
  const x: number[] = [];
  const y: number[] = [];
  for (const [concentration, intensityRatio] of intensityMeans) {
    const match = [...lifetimeMeans].find(([c]) => Math.abs(c - concentration) <= 1e-9 * Math.max(c, concentration));
    if (!match) continue;
    x.push(concentration);
    y.push(intensityRatio / match[1] - 1);
  }
  if (x.length < 3) return null;
  const fit = fitLineThroughOrigin(x, y);
  return makeEstimate(fit.slope, fit.slopeStandardError, fit.degreesOfFreedom);
}

function meanByConcentration(points: SternVolmerFit['points']): Map<number, number> {
  const sums = new Map<number, { sum: number; count: number }>();
  points.concentrations.forEach((concentration, i) => {
    const entry = sums.get(concentration) ?? { sum: 0, count: 0 };
    entry.sum += points.ratios[i]!; // ratios has one entry per concentration
    entry.count++;
    sums.set(concentration, entry);
  });
  return new Map([...sums].map(([concentration, { sum, count }]) => [concentration, sum / count]));
}
