import { EngineError } from '../core/engine-error';
import { formatNumber, UNITS } from '../../format';
import { countDistinct, requireNonNegativeArray, requirePositiveArray, requireSameLength } from '../core/validate';
import { fitQuadratic } from '../stats/fit-quadratic';
import { makeEstimate, type ParameterEstimate } from '../stats/parameter-estimate';

export interface StaticDynamicFit {
  /** b1 = K_D + K_S, M^-1 */
  sum: ParameterEstimate;
  /** b2 = K_D K_S, M^-2 */
  product: ParameterEstimate;
  /** the larger and the smaller root of z^2 - b1 z + b2 = 0, M^-1 */
  largerRoot: ParameterEstimate;
  smallerRoot: ParameterEstimate;
  /** which root is K_D, and why */
  assignment:
    | {
        kind: 'resolved';
        kD: ParameterEstimate;
        kS: ParameterEstimate;
        rule: 'closest-to-lifetime-slope' | 'dynamic-root-below-diffusion-bound';
      }
    | { kind: 'ambiguous'; rule: string };
  residualStandardDeviation: number;
  degreesOfFreedom: number;
  n: number;
}

/**
 * Combined static and dynamic quenching, I0/I = (1 + K_D[Q])(1 + K_S[Q]) = 1 + (K_D +
 * K_S)[Q] + K_D K_S [Q]^2 (Lakowicz, Principles of Fluorescence Spectroscopy, 3rd ed.,
 * ch. 8). I0/I - 1 is fitted by b1 [Q] + b2 [Q]^2 through the origin; K_D and K_S are
 * the two roots of z^2 - b1 z + b2 = 0, with standard errors by first-order propagation
 * of the (b1, b2) covariance. Intensity data alone cannot say which root is which:
 * - with a lifetime slope (kq tau0 from tau0/tau), K_D is the root closer to it;
 * - else, with a bound on K_D (k_diff tau0), a root above the bound cannot be K_D;
 * - else both roots are returned and the assignment is reported as ambiguous.
 *
 * @param input.concentrations - [Q] in mol/L (>= 0, at least 3 distinct)
 * @param input.ratios - I0/I (> 0)
 * @param input.lifetimeSlope - optional K_SV from lifetime data, M^-1
 * @param input.maxDynamicConstant - optional upper bound on K_D (k_diff tau0), M^-1
 * @throws EngineError MODEL_NOT_APPLICABLE when b2 <= 0 or b1^2 < 4 b2 (no positive real roots), TOO_FEW_CONCENTRATIONS
 * @example fitStaticDynamic({ concentrations: [0, 0.01, 0.02, 0.03], ratios: [1, 1.65, 2.4, 3.25] }).largerRoot.value // 50 (K_S = 10)
 */
export function fitStaticDynamic(input: {
  concentrations: readonly number[];
  ratios: readonly number[];
  lifetimeSlope?: number;
  maxDynamicConstant?: number;
}): StaticDynamicFit {
  const { concentrations, ratios, lifetimeSlope, maxDynamicConstant } = input;
  requireSameLength(concentrations, ratios, 'concentrations', 'ratios');
  requireNonNegativeArray(concentrations, 'concentrations');
  requirePositiveArray(ratios, 'ratios');
  if (countDistinct(concentrations) < 3) {
    throw new EngineError(
      'TOO_FEW_CONCENTRATIONS',
      'concentrations',
      'the quadratic model needs at least 3 distinct concentrations',
    );
  }
  const quadratic = fitQuadratic(
    concentrations,
    ratios.map((ratio) => ratio - 1),
    { throughOrigin: true },
  );
  const df = quadratic.degreesOfFreedom;
  const [, b1, b2] = quadratic.coefficients;
  const discriminant = b1 * b1 - 4 * b2;
  if (!(b2 > 0) || !(b1 > 0) || discriminant < 0) {
    throw new EngineError(
      'MODEL_NOT_APPLICABLE',
      'ratios',
      `the quadratic coefficients (b1 = ${formatNumber(b1)} ${UNITS.perMolar}, b2 = ${formatNumber(b2)} ${UNITS.perMolarSquared}) have no pair of positive real roots`,
      b2 <= 0
        ? 'The plot bends downward; try the modified Stern–Volmer plot'
        : 'The curvature is too strong for this model; check inner filter and aggregation',
    );
  }
  const [seB1, seB2] = [quadratic.standardErrors[1], quadratic.standardErrors[2]];
  const covariance = quadratic.covarianceB1B2;
  const rootOfD = Math.sqrt(discriminant);
  const root = (sign: 1 | -1): ParameterEstimate => {
    // z = (b1 +- sqrt(D)) / 2; dz/db1 = (1 +- b1/sqrt D)/2, dz/db2 = -+1/sqrt D
    const d1 = (1 + (sign * b1) / rootOfD) / 2;
    const d2 = -sign / rootOfD;
    const variance = d1 * d1 * seB1 * seB1 + d2 * d2 * seB2 * seB2 + 2 * d1 * d2 * covariance;
    return makeEstimate((b1 + sign * rootOfD) / 2, Math.sqrt(Math.max(variance, 0)), df);
  };
  const largerRoot = root(1);
  const smallerRoot = root(-1);
  return {
    sum: makeEstimate(b1, seB1, df),
    product: makeEstimate(b2, seB2, df),
    largerRoot,
    smallerRoot,
    assignment: assignRoots(largerRoot, smallerRoot, lifetimeSlope, maxDynamicConstant),
    residualStandardDeviation: quadratic.residualStandardDeviation,
    degreesOfFreedom: df,
    n: quadratic.n,
  };
}

function assignRoots(
  larger: ParameterEstimate,
  smaller: ParameterEstimate,
  lifetimeSlope: number | undefined,
  maxDynamic: number | undefined,
): StaticDynamicFit['assignment'] {
  if (lifetimeSlope !== undefined && Number.isFinite(lifetimeSlope)) {
    const largerIsDynamic = Math.abs(larger.value - lifetimeSlope) <= Math.abs(smaller.value - lifetimeSlope);
    return {
      kind: 'resolved',
      kD: largerIsDynamic ? larger : smaller,
      kS: largerIsDynamic ? smaller : larger,
      rule: 'closest-to-lifetime-slope',
    };
  }
  if (maxDynamic !== undefined && larger.value > maxDynamic && smaller.value <= maxDynamic) {
    return { kind: 'resolved', kD: smaller, kS: larger, rule: 'dynamic-root-below-diffusion-bound' };
  }
  return {
    kind: 'ambiguous',
    rule: 'Intensity data alone fit either assignment equally well; a lifetime series (K_D is the root closer to its slope) or the diffusion bound k_diff tau0 on K_D decides.',
  };
}
