import {
  requireFiniteArray,
  requireNonNegative,
  requireNonNegativeArray,
  requirePositive,
  requireSameLength,
} from '../core/validate';

export interface DilutionCorrectedPoint {
  /** [Q] after mixing, mol/L */
  concentration: number;
  /** (V0 + V_added) / V0 */
  dilutionFactor: number;
  /** I_obs times the dilution factor, or I_obs when the stock holds the emitter */
  correctedIntensity: number | null;
}

/**
 * Dilution during a titration: [Q] = c_stock V_added / (V0 + V_added) and I_corr =
 * I_obs (V0 + V_added) / V0, because the emitter is diluted by the same factor (mass
 * balance of ideal mixing). When the stock also holds the emitter at the starting
 * concentration the emitter is not diluted and intensities are left as measured.
 *
 * @param input.initialVolume - V0 in L (> 0)
 * @param input.stockConcentration - quencher stock, mol/L (> 0)
 * @param input.cumulativeAddedVolumes - total stock added before each reading, L (>= 0)
 * @param input.intensities - optional observed intensities, one per reading
 * @param input.stockContainsEmitter - default false
 * @throws EngineError NON_POSITIVE_VALUE, NEGATIVE_VALUE, NON_FINITE_VALUE, LENGTH_MISMATCH
 * @example
 * correctDilution({ initialVolume: 2e-3, stockConcentration: 0.1, cumulativeAddedVolumes: [0, 2e-5], intensities: [100, 90] })[1]
 * // { concentration: 0.000990..., dilutionFactor: 1.01, correctedIntensity: 90.9 }
 */
export function correctDilution(input: {
  initialVolume: number;
  stockConcentration: number;
  cumulativeAddedVolumes: readonly number[];
  intensities?: readonly number[];
  stockContainsEmitter?: boolean;
}): DilutionCorrectedPoint[] {
  const v0 = requirePositive(input.initialVolume, 'initialVolume');
  const stock = requirePositive(input.stockConcentration, 'stockConcentration');
  requireNonNegativeArray(input.cumulativeAddedVolumes, 'cumulativeAddedVolumes');
  const { intensities, stockContainsEmitter = false } = input;
  if (intensities) {
    requireSameLength(input.cumulativeAddedVolumes, intensities, 'cumulativeAddedVolumes', 'intensities');
    requireFiniteArray(intensities, 'intensities');
  }
  return input.cumulativeAddedVolumes.map((added, i) => {
    requireNonNegative(added, `cumulativeAddedVolumes[${i}]`);
    const total = v0 + added;
    const dilutionFactor = total / v0;
    // requireSameLength above: intensities has one value per addition, so index i exists.
    const observed = intensities ? intensities[i]! : null;
    return {
      concentration: (stock * added) / total,
      dilutionFactor,
      correctedIntensity: observed === null ? null : stockContainsEmitter ? observed : observed * dilutionFactor,
    };
  });
}
