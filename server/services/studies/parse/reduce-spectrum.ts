import { ParseProblem } from './parse-problem';

/** Sorted copy of (x, y) pairs by wavelength (stable, so equal wavelengths keep file order). */
function sorted(x: readonly number[], y: readonly number[]) {
  // Instruments mostly write ascending wavelengths: then the stable sort would change nothing.
  if (x.every((value, i) => i === 0 || x[i - 1]! <= value)) return { xs: x, ys: y };
  const order = x.map((_, i) => i).sort((a, b) => x[a]! - x[b]!);
  return { xs: order.map((i) => x[i]!), ys: order.map((i) => y[i]!) };
}

/**
 * Linear interpolation on sorted readings inside [xs[0], xs.at(-1)]: the first segment
 * [xs[j], xs[j+1]] that holds `at`, found by bisection (a spectrum has thousands of readings
 * and a window integral interpolates at every one of them).
 */
function interpolateSorted(xs: readonly number[], ys: readonly number[], at: number): number {
  if (xs.length < 2) return ys.at(-1)!;
  // First k >= 1 with xs[k] >= at; its segment starts at k - 1.
  let low = 1;
  let high = xs.length - 1;
  if (!(xs[high]! >= at)) return ys.at(-1)!;
  while (low < high) {
    const middle = (low + high) >>> 1;
    if (xs[middle]! >= at) high = middle;
    else low = middle + 1;
  }
  const i = low - 1;
  const span = xs[i + 1]! - xs[i]!;
  return span === 0 ? ys[i]! : ys[i]! + ((ys[i + 1]! - ys[i]!) * (at - xs[i]!)) / span;
}

/** Linear interpolation inside the measured range; outside it is an error. */
export function valueAt(x: readonly number[], y: readonly number[], at: number): number {
  const { xs, ys } = sorted(x, y);
  if (at < xs[0]! || at > xs.at(-1)!)
    throw new ParseProblem(`The reading wavelength ${at} nm lies outside the spectrum (${xs[0]}–${xs.at(-1)} nm).`);
  return interpolateSorted(xs, ys, at);
}

/**
 * Integral of a spectrum over [start, end] nm by the trapezoid rule, with the window edges
 * placed by linear interpolation (so a window between two readings is not rounded to them).
 */
export function integrateWindow(x: readonly number[], y: readonly number[], start: number, end: number): number {
  if (!(end > start)) throw new ParseProblem(`The integration window must end above its start (${start}–${end} nm).`);
  const { xs, ys } = sorted(x, y);
  if (start < xs[0]! || end > xs.at(-1)!)
    throw new ParseProblem(`The window ${start}–${end} nm reaches outside the spectrum (${xs[0]}–${xs.at(-1)} nm).`);
  // Trapezoids summed as the readings are walked: start edge, every reading inside, end edge.
  let area = 0;
  let previousX = start;
  let previousY = interpolateSorted(xs, ys, start);
  const step = (nextX: number) => {
    const nextY = interpolateSorted(xs, ys, nextX);
    area += ((previousY + nextY) / 2) * (nextX - previousX);
    previousX = nextX;
    previousY = nextY;
  };
  for (const value of xs) if (value > start && value < end) step(value);
  step(end);
  return area;
}
