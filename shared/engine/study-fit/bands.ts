import { fitLine } from '../stats/fit-line';
import { fitQuadratic } from '../stats/fit-quadratic';
import { studentTQuantile975 } from '../stats/student-t';

export interface BandPoint {
  x: number;
  y: number;
  lower: number;
  upper: number;
}

const SAMPLES = 40;

function sampleX(x: readonly number[], from = 0): number[] {
  const max = Math.max(...x);
  const start = Math.min(from, ...x);
  return Array.from({ length: SAMPLES + 1 }, (_, i) => start + ((max - start) * i) / SAMPLES);
}

/**
 * Fitted line with its 95 % confidence band, var(y) = se_a^2 + x^2 se_b^2 + 2x cov(a,b)
 * (standard result for a least-squares line; the engine's fitLine supplies the covariance).
 */
export function freeLineBand(
  x: readonly number[],
  y: readonly number[],
  weights?: readonly number[],
  from = 0,
): BandPoint[] {
  const line = fitLine(x, y, weights);
  const t = studentTQuantile975(line.degreesOfFreedom);
  return sampleX(x, from).map((xi) => {
    const yi = line.intercept + line.slope * xi;
    const variance =
      line.interceptStandardError ** 2 +
      xi * xi * line.slopeStandardError ** 2 +
      2 * xi * line.slopeInterceptCovariance;
    const half = t * Math.sqrt(Math.max(variance, 0));
    return { x: xi, y: yi, lower: yi - half, upper: yi + half };
  });
}

/** Line 1 + K x through (0, 1): the band is t * x * SE(K). */
export function fixedLineBand(
  x: readonly number[],
  k: number,
  kStandardError: number,
  degreesOfFreedom: number,
): BandPoint[] {
  const t = studentTQuantile975(degreesOfFreedom);
  return sampleX(x).map((xi) => {
    const yi = 1 + k * xi;
    return { x: xi, y: yi, lower: yi - t * xi * kStandardError, upper: yi + t * xi * kStandardError };
  });
}

/** 1 + b1 x + b2 x^2 with the band from the (b1, b2) covariance of the engine's fitQuadratic. */
export function quadraticBand(x: readonly number[], ratios: readonly number[]): BandPoint[] {
  const fit = fitQuadratic(
    x,
    ratios.map((ratio) => ratio - 1),
    { throughOrigin: true },
  );
  const [, b1, b2] = fit.coefficients;
  const [, se1, se2] = fit.standardErrors;
  const t = studentTQuantile975(fit.degreesOfFreedom);
  return sampleX(x).map((xi) => {
    const yi = 1 + b1 * xi + b2 * xi * xi;
    const variance = xi * xi * se1 * se1 + xi ** 4 * se2 * se2 + 2 * xi ** 3 * fit.covarianceB1B2;
    const half = t * Math.sqrt(Math.max(variance, 0));
    return { x: xi, y: yi, lower: yi - half, upper: yi + half };
  });
}
