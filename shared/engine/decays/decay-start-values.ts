import { EngineError } from '../core/engine-error';
import { solveLeastSquares } from '../stats/solve-least-squares';
import { convolveExponential } from './convolve-exponential';
import type { DecayModelSetup } from './decay-model';
import { invertPositiveDefinite } from './invert-positive-definite';

export interface DecayStartContext {
  counts: ArrayLike<number>;
  from: number;
  to: number;
  background: number;
  /** channel of the response peak and its width in channels (reconvolution) */
  responsePeak: number | null;
  responseWidth: number | null;
}

/** Weighted straight line through ln(counts - background) over channels: slope and value at `origin`. */
function logLinear(points: Array<{ channel: number; excess: number }>, origin: number) {
  if (points.length < 5) return null;
  try {
    const fit = solveLeastSquares(
      [points.map(() => 1), points.map((point) => point.channel - origin)],
      points.map((point) => Math.log(point.excess)),
      // var(ln y) ~ 1/y for counts (common practice)
      points.map((point) => point.excess),
    );
    const [intercept, slope] = fit.coefficients as [number, number];
    return slope < 0 ? { lifetime: -1 / slope, amplitude: Math.exp(intercept) } : null;
  } catch (error) {
    if (error instanceof EngineError) return null;
    throw error;
  }
}

/**
 * Lifetimes to start from, in channels, longest found first and returned shortest first: the
 * log-linear tail (a weighted straight line through ln(counts - background), common practice;
 * O'Connor & Phillips, 1984, ch. 6), peeled for two or three exponentials (the latest part of
 * the tail gives the longest lifetime, whose line is subtracted before the earlier part is
 * fitted). When peeling gives no ordered set, the single lifetime spread by fixed factors.
 */
export function startLifetimes(context: DecayStartContext, components: number): number[] {
  const { counts, to, background } = context;
  let peak = context.from;
  for (let i = context.from; i <= to; i++) if (counts[i]! > counts[peak]!) peak = i;
  const settle = context.responsePeak === null ? 0 : context.responsePeak + 2 * (context.responseWidth ?? 0);
  const first = Math.max(peak, Math.ceil(settle), context.from);
  const floor = Math.max(3 * Math.sqrt(Math.max(background, 1)), counts[peak]! / 1000);
  let last = first;
  for (let i = first; i <= to; i++) if (counts[i]! - background > floor) last = i;
  const excess = (i: number) => counts[i]! - background;
  const tail = [];
  for (let i = first; i <= last; i++) if (excess(i) > 0.5) tail.push({ channel: i, excess: excess(i) });
  const single = logLinear(tail, first)?.lifetime ?? Math.max(2, (last - first) / 3);
  if (components === 1) return [single];
  const fallback = components === 2 ? [0.4, 1.6] : [0.25, 0.8, 2];
  const cuts = components === 2 ? [0, 0.5, 1] : [0, 0.2, 0.5, 1];
  const span = last - first;
  const peeled: number[] = [];
  const removed = new Float64Array(last + 1);
  for (let part = components - 1; part >= 0; part--) {
    const from = first + Math.round(cuts[part]! * span);
    const upto = first + Math.round(cuts[part + 1]! * span);
    const points = [];
    for (let i = from; i <= upto; i++) {
      const rest = excess(i) - removed[i]!;
      if (rest > floor) points.push({ channel: i, excess: rest });
    }
    const line = logLinear(points, first);
    if (!line || (peeled.length > 0 && line.lifetime > 0.9 * peeled[peeled.length - 1]!))
      return fallback.map((factor) => factor * single);
    peeled.push(line.lifetime);
    for (let i = first; i <= last; i++) removed[i]! += line.amplitude * Math.exp(-(i - first) / line.lifetime);
  }
  return peeled.reverse();
}

/**
 * Amplitudes and background for given lifetimes (and shift), by weighted linear least squares
 * on the model's columns (weights 1/max(counts, 1), normal equations of K + 1 unknowns);
 * negative amplitudes are lifted to a small positive value so the iterations start inside the
 * bounds. Returns the start vector and its weighted sum of squares.
 */
export function startAmplitudes(
  setup: DecayModelSetup,
  context: DecayStartContext,
  lifetimes: readonly number[],
  shift: number,
  columns: Float64Array[] = lifetimes.map(() => new Float64Array(context.to + 1)),
): { start: number[]; sumOfSquares: number } {
  const K = lifetimes.length;
  const { from, to, counts } = context;
  lifetimes.forEach((tau, k) => {
    const column = columns[k]!;
    if (setup.method === 'reconvolution') convolveExponential(setup.response!, shift, 1 / tau, column);
    else for (let i = from; i <= to; i++) column[i] = Math.exp(-(i - setup.origin) / tau);
  });
  const size = K + 1;
  // Flat upper triangle of the normal matrix, the right-hand side and sum(w c^2), in one pass.
  const normal = new Float64Array(size * size);
  const right = new Float64Array(size);
  const row = new Float64Array(size).fill(1);
  let weightedSquares = 0;
  let peak = 0;
  for (let i = from; i <= to; i++) {
    const c = counts[i]!;
    if (c > peak) peak = c;
    const weight = 1 / Math.max(c, 1);
    weightedSquares += weight * c * c;
    for (let k = 0; k < K; k++) row[k] = columns[k]![i]!;
    for (let a = 0; a < size; a++) {
      const wa = weight * row[a]!;
      right[a]! += wa * c;
      for (let b = a; b < size; b++) normal[a * size + b]! += wa * row[b]!;
    }
  }
  const matrix = Array.from({ length: size }, (_, a) =>
    Array.from({ length: size }, (_, b) => normal[Math.min(a, b) * size + Math.max(a, b)]!),
  );
  const inverse = invertPositiveDefinite(matrix);
  const coefficients = inverse
    ? inverse.map((line) => line.reduce((sum, value, b) => sum + value * right[b]!, 0))
    : [...lifetimes.map(() => peak / K), context.background];
  const lifted = coefficients.slice(0, K).some((a) => !(a > 0)) || !(coefficients[K]! >= 0) || !inverse;
  const amplitudes = coefficients.slice(0, K).map((a) => (a > 0 ? a : peak / (100 * K)));
  const background = Math.max(0, coefficients[K]!);
  let sumOfSquares: number;
  if (!lifted) {
    // sum w (c - X b)^2 = sum w c^2 - b^T (X^T W c) at the least-squares solution
    sumOfSquares = weightedSquares - coefficients.reduce((sum, value, a) => sum + value * right[a]!, 0);
  } else {
    sumOfSquares = 0;
    for (let i = from; i <= to; i++) {
      let m = background;
      for (let k = 0; k < K; k++) m += amplitudes[k]! * columns[k]![i]!;
      sumOfSquares += (counts[i]! - m) ** 2 / Math.max(counts[i]!, 1);
    }
  }
  return {
    start: [
      ...lifetimes.map((tau) => Math.log(tau)),
      ...amplitudes,
      background,
      ...(setup.method === 'reconvolution' ? [shift] : []),
    ],
    sumOfSquares,
  };
}

/**
 * Full start vector: lifetimes from the tail, then (reconvolution) the shift with the lowest
 * weighted sum of squares on a whole-channel grid, amplitudes and background by linear least
 * squares at each shift.
 */
export function decayStartValues(setup: DecayModelSetup, context: DecayStartContext, shiftRange: number): number[] {
  const lifetimes = startLifetimes(context, setup.components);
  if (setup.method === 'tail') return startAmplitudes(setup, context, lifetimes, 0).start;
  let best: { start: number[]; sumOfSquares: number } | null = null;
  const columns = lifetimes.map(() => new Float64Array(context.to + 1));
  // Whole channels are enough here: the iterations refine the shift continuously.
  for (let shift = -shiftRange; shift <= shiftRange; shift += 1) {
    const candidate = startAmplitudes(setup, context, lifetimes, shift, columns);
    if (!best || candidate.sumOfSquares < best.sumOfSquares) best = candidate;
  }
  return best!.start;
}
