import { EngineError } from '../core/engine-error';
import { requirePositiveArray, requireSameLength } from '../core/validate';
import { fitLineThroughOrigin } from '../stats/fit-line-through-origin';
import { makeEstimate, type ParameterEstimate } from '../stats/parameter-estimate';

/**
 * K_SV of one band of a spectrum matrix with a standard error that includes the band's I0:
 * I0/I − 1 = K_SV [Q] through the origin (Lakowicz, Principles of Fluorescence Spectroscopy,
 * 3rd ed., ch. 8), weighted by w = 1/σ², σ(I0/I) = (I0/I) σ_I / I from the known reading noise.
 * The SE is the larger of the noise-based 1/√Σw[Q]² and the residual-based one (the Birge ratio
 * guard: scatter beyond the noise widens it; Birge, Phys. Rev. 1932, 40, 207), and the error of
 * I0 (the mean of the blanks, σ_I0 = σ/√n) enters by first-order propagation: every ratio
 * scales with I0, so dK/d ln I0 = K + Σw[Q] / Σw[Q]². With zero noise given, the fit is
 * unweighted and the SE residual-based.
 *
 * @param concentrations - mol/L, the blanks at 0
 * @param intensities - band intensities (> 0), one per concentration
 * @param sigmas - noise SD of each band intensity (≥ 0)
 * @throws EngineError MISSING_I0, TOO_FEW_POINTS (fewer than 2 quenched points), NON_POSITIVE_VALUE
 * @example bandKsv([0, 1e-3, 2e-3], [100, 50, 100 / 3], [1, 1, 1]).value // ≈ 1000
 */
export function bandKsv(
  concentrations: readonly number[],
  intensities: readonly number[],
  sigmas: readonly number[],
): ParameterEstimate {
  requireSameLength(concentrations, intensities, 'concentrations', 'intensities');
  requireSameLength(concentrations, sigmas, 'concentrations', 'sigmas');
  requirePositiveArray(intensities, 'intensities');
  const blanks = concentrations.flatMap((q, i) => (q === 0 ? [i] : []));
  if (blanks.length === 0)
    throw new EngineError('MISSING_I0', 'concentrations', 'no blank at [Q] = 0', 'Add the spectrum without quencher');
  const i0 = blanks.reduce((sum, i) => sum + intensities[i]!, 0) / blanks.length;
  const i0RelativeError = Math.sqrt(blanks.reduce((sum, i) => sum + sigmas[i]! ** 2, 0)) / blanks.length / i0;
  const quenched = concentrations.flatMap((q, i) => (q > 0 ? [i] : []));
  const q = quenched.map((i) => concentrations[i]!);
  const ratios = quenched.map((i) => i0 / intensities[i]!);
  const known = quenched.every((i) => sigmas[i]! > 0);
  const weights = known ? quenched.map((i, k) => 1 / ((ratios[k]! * sigmas[i]!) / intensities[i]!) ** 2) : undefined;
  const fit = fitLineThroughOrigin(
    q,
    ratios.map((ratio) => ratio - 1),
    weights,
  );
  let sumWq = 0;
  let sumWqq = 0;
  // k < q.length: every array here has one entry per quenched point.
  for (let k = 0; k < q.length; k++) {
    const w = weights ? weights[k]! : 1;
    sumWq += w * q[k]!;
    sumWqq += w * q[k]! * q[k]!;
  }
  const fitError = known ? Math.max(1 / Math.sqrt(sumWqq), fit.slopeStandardError) : fit.slopeStandardError;
  const i0Error = Math.abs(fit.slope + sumWq / sumWqq) * i0RelativeError;
  return makeEstimate(fit.slope, Math.hypot(fitError, i0Error), fit.degreesOfFreedom);
}
