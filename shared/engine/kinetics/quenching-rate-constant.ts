import { requireFinite, requireNonNegative, requirePositive } from '../core/validate';
import { qualityFlag, type QualityFlag } from '../flags/quality-flag';
import { formatNumber, UNITS } from '../../format';

export interface QuenchingRateConstant {
  /** kq in M^-1 s^-1 */
  value: number;
  standardError: number;
  /** sqrt((SE_K/K)^2 + (SE_tau0/tau0)^2) */
  relativeUncertainty: number;
  /** kq / k_diff when a diffusion limit was given */
  fractionOfDiffusionLimit: number | null;
  flags: QualityFlag[];
}

/**
 * Bimolecular quenching rate constant kq = K_SV / tau0 (Stern–Volmer relation, IUPAC
 * Gold Book S06004), the relative uncertainties of K_SV and tau0 combined in quadrature
 * (first-order propagation for a quotient of independent quantities). Flags kq above the
 * diffusion limit when one is given.
 *
 * @param input.kSv - Stern–Volmer constant, M^-1 (finite)
 * @param input.kSvStandardError - M^-1 (>= 0), default 0
 * @param input.tau0 - unquenched lifetime, s (> 0)
 * @param input.tau0StandardError - s (>= 0), default 0
 * @param input.diffusionLimit - optional k_diff in M^-1 s^-1 (> 0)
 * @throws EngineError NON_POSITIVE_VALUE, NEGATIVE_VALUE, NON_FINITE_VALUE
 * @example quenchingRateConstant({ kSv: 1100, tau0: 1.1e-6 }).value // 1e9
 */
export function quenchingRateConstant(input: {
  kSv: number;
  kSvStandardError?: number;
  tau0: number;
  tau0StandardError?: number;
  diffusionLimit?: number;
}): QuenchingRateConstant {
  const kSv = requireFinite(input.kSv, 'kSv');
  const kSvError = requireNonNegative(input.kSvStandardError ?? 0, 'kSvStandardError');
  const tau0 = requirePositive(input.tau0, 'tau0', 'The unquenched lifetime must be a positive time in seconds');
  const tau0Error = requireNonNegative(input.tau0StandardError ?? 0, 'tau0StandardError');
  const value = kSv / tau0;
  const relativeK = kSv === 0 ? 0 : kSvError / Math.abs(kSv);
  const relativeUncertainty = Math.sqrt(relativeK ** 2 + (tau0Error / tau0) ** 2);
  // With K_SV = 0 the relative form is undefined; the absolute error is SE_K / tau0.
  const standardError = kSv === 0 ? kSvError / tau0 : Math.abs(value) * relativeUncertainty;
  const flags: QualityFlag[] = [];
  let fractionOfDiffusionLimit: number | null = null;
  if (input.diffusionLimit !== undefined) {
    const limit = requirePositive(input.diffusionLimit, 'diffusionLimit');
    fractionOfDiffusionLimit = value / limit;
    if (value > limit) {
      flags.push(
        qualityFlag(
          'KQ_ABOVE_DIFFUSION_LIMIT',
          `kq ${formatNumber(value)} vs k_diff ${formatNumber(limit)} ${UNITS.perMolarPerSecond}`,
        ),
      );
    }
  }
  return { value, standardError, relativeUncertainty, fractionOfDiffusionLimit, flags };
}
