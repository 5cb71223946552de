import { EngineError } from '../core/engine-error';
import { requireNonNegative, requirePositive } from '../core/validate';
import { qualityFlag, type QualityFlag } from '../flags/quality-flag';

export interface TitrationStep {
  /** requested [Q], mol/L */
  target: number;
  /** volume of stock to add at this step, µL (after rounding to the pipette step) */
  additionMicrolitres: number;
  /** total stock added so far, µL */
  cumulativeAddedMicrolitres: number;
  /** V0 + added, µL */
  totalVolumeMicrolitres: number;
  /** [Q] actually reached with the rounded volumes, mol/L */
  concentration: number;
  /** emitter concentration after dilution, mol/L */
  emitterConcentration: number;
}

export interface TitrationPlan {
  steps: TitrationStep[];
  /** fractional drop of the emitter concentration at the end, added / (V0 + added) */
  totalDilution: number;
  flags: QualityFlag[];
}

/** Dilution beyond this fraction is flagged (common practice: about 10 %). */
export const DILUTION_WARNING = 0.1;

/**
 * Titration planner: cumulative stock volume for a target [Q] from the mass balance
 * c V_add / (V0 + V_add) = target, i.e. V_add = target V0 / (c_stock - target); each step
 * adds the difference. Volumes can be rounded to a pipette step, and the concentration
 * really reached is reported. When the stock also holds the emitter at the starting
 * concentration, the emitter is not diluted.
 *
 * @param input.initialVolume - V0, L (> 0)
 * @param input.emitterConcentration - mol/L (> 0)
 * @param input.stockConcentration - quencher stock, mol/L (> 0)
 * @param input.targets - increasing target concentrations, mol/L; or
 * @param input.maximum - with input.count: targets maximum * k / count, k = 1..count
 * @param input.volumeStep - optional pipette resolution, L (> 0)
 * @param input.stockContainsEmitter - default false
 * @throws EngineError TARGET_UNREACHABLE (target >= stock), INVALID_ARGUMENT (no or decreasing targets), NON_POSITIVE_VALUE
 * @example
 * planTitration({ initialVolume: 2e-3, emitterConcentration: 1e-5, stockConcentration: 0.1, targets: [1e-3] })
 *   .steps[0].additionMicrolitres // 20.2020...
 */
export function planTitration(input: {
  initialVolume: number;
  emitterConcentration: number;
  stockConcentration: number;
  targets?: readonly number[];
  maximum?: number;
  count?: number;
  volumeStep?: number;
  stockContainsEmitter?: boolean;
}): TitrationPlan {
  const v0 = requirePositive(input.initialVolume, 'initialVolume');
  const emitter = requirePositive(input.emitterConcentration, 'emitterConcentration');
  const stock = requirePositive(input.stockConcentration, 'stockConcentration');
  const step = input.volumeStep === undefined ? undefined : requirePositive(input.volumeStep, 'volumeStep');
  const targets = resolveTargets(input);
  let previousAdded = 0;
  const steps = targets.map((target, i): TitrationStep => {
    requireNonNegative(target, `targets[${i}]`);
    if (target >= stock) {
      throw new EngineError(
        'TARGET_UNREACHABLE',
        `targets[${i}]`,
        `${target} mol/L cannot be reached with a ${stock} mol/L stock (the mixture is always more dilute than the stock)`,
        'Use a more concentrated stock or a lower target',
      );
    }
    const exact = (target * v0) / (stock - target);
    const added = step === undefined ? exact : Math.round(exact / step) * step;
    if (added < previousAdded) {
      throw new EngineError(
        'INVALID_ARGUMENT',
        `targets[${i}]`,
        'targets must not decrease: stock cannot be taken out again',
      );
    }
    const total = v0 + added;
    const addition = added - previousAdded;
    previousAdded = added;
    return {
      target,
      additionMicrolitres: addition * 1e6,
      cumulativeAddedMicrolitres: added * 1e6,
      totalVolumeMicrolitres: total * 1e6,
      concentration: (stock * added) / total,
      emitterConcentration: input.stockContainsEmitter ? emitter : (emitter * v0) / total,
    };
  });
  const totalDilution = previousAdded / (v0 + previousAdded);
  const flags =
    !input.stockContainsEmitter && totalDilution > DILUTION_WARNING
      ? [qualityFlag('LARGE_DILUTION', `emitter diluted by ${(totalDilution * 100).toFixed(1)} %`)]
      : [];
  return { steps, totalDilution, flags };
}

function resolveTargets(input: { targets?: readonly number[]; maximum?: number; count?: number }): readonly number[] {
  if (input.targets && input.targets.length > 0) return input.targets;
  if (input.maximum !== undefined && input.count !== undefined) {
    const maximum = requirePositive(input.maximum, 'maximum');
    if (!Number.isInteger(input.count) || input.count < 1) {
      throw new EngineError('INVALID_ARGUMENT', 'count', `must be a whole number of at least 1, got ${input.count}`);
    }
    return Array.from({ length: input.count }, (_, k) => (maximum * (k + 1)) / input.count!);
  }
  throw new EngineError('INVALID_ARGUMENT', 'targets', 'give target concentrations, or a maximum and a count');
}
