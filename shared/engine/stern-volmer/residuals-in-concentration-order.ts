/**
 * Residuals taken in order of increasing concentration, ties ordered by residual, so a
 * runs test on them does not depend on the order the points were entered in. Returns the
 * residuals themselves when the concentrations already increase.
 *
 * @param x - concentrations
 * @param residuals - residuals of a fit, same order as x
 * @example residualsInConcentrationOrder([2, 0, 1], [0.3, 0.1, -0.2]) // [0.1, -0.2, 0.3]
 */
export function residualsInConcentrationOrder(x: ArrayLike<number>, residuals: ArrayLike<number>): ArrayLike<number> {
  let sorted = true;
  // Every index below is 0 <= i < x.length, and residuals has the same length as x.
  for (let i = 1; i < x.length && sorted; i++) sorted = x[i]! > x[i - 1]!;
  if (sorted) return residuals;
  const order = Array.from({ length: x.length }, (_, i) => i);
  order.sort((a, b) => x[a]! - x[b]! || residuals[a]! - residuals[b]!);
  return order.map((i) => residuals[i]!);
}
