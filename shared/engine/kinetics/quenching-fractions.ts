import { EngineError } from '../core/engine-error';
import { requireNonNegative, requirePositive } from '../core/validate';

export interface QuenchingShare {
  id: string;
  /** kq_i c_i, s^-1 */
  pseudoFirstOrderRate: number;
  /** fraction of excited states intercepted by this component */
  fraction: number;
}

export interface QuenchingFractions {
  components: QuenchingShare[];
  /** fraction that decays without being quenched, (1/tau0) / total */
  unquenched: number;
  /** 1/tau0 + sum kq_j c_j, s^-1 */
  totalDecayRate: number;
  /** kept with the numbers wherever they are shown */
  caution: string;
}

/**
 * Competition between quenchers at reaction conditions: the fraction of excited
 * catalyst intercepted by component i is kq_i c_i / (1/tau0 + sum_j kq_j c_j), the rest
 * decays unquenched (first-order competition of parallel decay channels; the same
 * quenching-efficiency form as Inorg. Chem. 2023, 62, 7636, Table 2).
 *
 * @param input.tau0 - unquenched lifetime of the catalyst, s (> 0)
 * @param input.components - id, kq (M^-1 s^-1, >= 0) and concentration (mol/L, >= 0) each
 * @throws EngineError NON_POSITIVE_VALUE, NEGATIVE_VALUE, INVALID_ARGUMENT (duplicate ids)
 * @example quenchingFractions({ tau0: 1e-6, components: [{ id: 'amine', kq: 1e9, concentration: 1e-3 }] }).components[0].fraction // 0.5
 */
export function quenchingFractions(input: {
  tau0: number;
  components: readonly { id: string; kq: number; concentration: number }[];
}): QuenchingFractions {
  const tau0 = requirePositive(input.tau0, 'tau0');
  const seen = new Set<string>();
  const rates = input.components.map((component, i) => {
    if (seen.has(component.id)) {
      throw new EngineError('INVALID_ARGUMENT', `components[${i}].id`, `"${component.id}" appears twice`);
    }
    seen.add(component.id);
    const kq = requireNonNegative(component.kq, `components[${i}].kq`);
    const concentration = requireNonNegative(component.concentration, `components[${i}].concentration`);
    return { id: component.id, rate: kq * concentration };
  });
  const intrinsic = 1 / tau0;
  const totalDecayRate = rates.reduce((sum, { rate }) => sum + rate, intrinsic);
  return {
    components: rates.map(({ id, rate }) => ({ id, pseudoFirstOrderRate: rate, fraction: rate / totalDecayRate })),
    unquenched: intrinsic / totalDecayRate,
    totalDecayRate,
    caution:
      'Quenching shows that a component meets the excited catalyst, not that the encounter leads to product; quantum yields and product studies decide that.',
  };
}
