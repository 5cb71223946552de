import { ParseProblem } from './parse-problem';

/** Sorted copy of (x, y) pairs by wavelength. */
function sorted(x: readonly number[], y: readonly number[]) {
  const order = x.map((_, i) => i).sort((a, b) => x[a]! - x[b]!);
  return { xs: order.map((i) => x[i]!), ys: order.map((i) => y[i]!) };
}

/** Linear interpolation inside the measured range; outside it is an error. */
export function valueAt(x: readonly number[], y: readonly number[], at: number): number {
  const { xs, ys } = sorted(x, y);
  if (at < xs[0]! || at > xs.at(-1)!) throw new ParseProblem(`The reading wavelength ${at} nm lies outside the spectrum (${xs[0]}–${xs.at(-1)} nm).`);
  for (let i = 0; i < xs.length - 1; i++) {
    if (at >= xs[i]! && at <= xs[i + 1]!) {
      const span = xs[i + 1]! - xs[i]!;
      return span === 0 ? ys[i]! : ys[i]! + ((ys[i + 1]! - ys[i]!) * (at - xs[i]!)) / span;
    }
  }
  return ys.at(-1)!;
}

/**
 * Integral of a spectrum over [start, end] nm by the trapezoid rule, with the window edges
 * placed by linear interpolation (so a window between two readings is not rounded to them).
 */
export function integrateWindow(x: readonly number[], y: readonly number[], start: number, end: number): number {
  if (!(end > start)) throw new ParseProblem(`The integration window must end above its start (${start}–${end} nm).`);
  const { xs, ys } = sorted(x, y);
  if (start < xs[0]! || end > xs.at(-1)!) throw new ParseProblem(`The window ${start}–${end} nm reaches outside the spectrum (${xs[0]}–${xs.at(-1)} nm).`);
  const px = [start, ...xs.filter((value) => value > start && value < end), end];
  const py = px.map((value) => valueAt(xs, ys, value));
  let area = 0;
  for (let i = 0; i < px.length - 1; i++) area += ((py[i]! + py[i + 1]!) / 2) * (px[i + 1]! - px[i]!);
  return area;
}
