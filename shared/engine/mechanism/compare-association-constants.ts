import { requireFinite, requireNonNegative } from '../core/validate';
import type { ParameterEstimate } from '../stats/parameter-estimate';

export interface AssociationAgreement {
  /** M^-1, K_a − K_S */
  difference: number;
  /** M^-1, √(SE_a² + SE_S²) */
  standardError: number;
  /** |difference| / standardError (Infinity when both SEs are 0 and the values differ) */
  z: number;
  /** |z| ≤ 1.96: the two agree at the 95 % level */
  agree: boolean;
}

/** Two independent estimates count as one value unless they differ by more than this many combined SEs (95 %, common practice). */
export const AGREEMENT_Z = 1.959963984540054;

/**
 * Do the association constant from absorption (K_a) and the static constant from the
 * combined static+dynamic Stern–Volmer fit (K_S) say the same? For a ground-state complex
 * that does not emit, K_S is its association constant (Lakowicz, Principles of Fluorescence
 * Spectroscopy, 3rd ed., ch. 8), so the two should agree. The difference of two independent
 * estimates has SE √(SE_a² + SE_S²) (first-order propagation; common practice); they agree
 * when the difference is within 1.96 of those SEs.
 *
 * @param kA - M^-1, from the absorption titration
 * @param kS - M^-1, from the study's fit
 * @throws EngineError NON_FINITE_VALUE, NEGATIVE_VALUE (a standard error)
 * @example compareAssociationConstants({ value: 120, standardError: 6, ... }, { value: 110, standardError: 8, ... }).agree // true (z = 1)
 */
export function compareAssociationConstants(kA: ParameterEstimate, kS: ParameterEstimate): AssociationAgreement {
  requireFinite(kA.value, 'kA');
  requireFinite(kS.value, 'kS');
  requireNonNegative(kA.standardError, 'kA.standardError');
  requireNonNegative(kS.standardError, 'kS.standardError');
  const difference = kA.value - kS.value;
  const standardError = Math.hypot(kA.standardError, kS.standardError);
  const z = standardError > 0 ? Math.abs(difference) / standardError : difference === 0 ? 0 : Infinity;
  return { difference, standardError, z, agree: z <= AGREEMENT_Z };
}
