import { GAS_CONSTANT } from '../core/constants';
import { EngineError } from '../core/engine-error';
import { requirePositive } from '../core/validate';
import { fitLine } from '../stats/fit-line';
import { studentTQuantile975 } from '../stats/student-t';
import { makeEstimate, type ParameterEstimate } from '../stats/parameter-estimate';
import { fitActivation, type ActivationFit } from './fit-activation';

export interface TemperaturePoint {
  /** K */
  temperature: number;
  /** M^-1 */
  kSv: number;
  kSvStandardError: number;
  /** solvent viscosity at this temperature, Pa s */
  viscosity: number;
  /** M^-1 s^-1, null when tau0 at this temperature is unknown */
  kq: number | null;
}

export type TemperatureVerdict = 'dynamic' | 'static' | 'mixed-or-unclear';

export interface TemperatureSeriesAnalysis {
  verdict: TemperatureVerdict;
  /** the reasons, in plain words with the numbers */
  reasons: string[];
  /** apparent activation energy of K_SV: -R d ln K_SV / d(1/T), J mol^-1 (> 0: K_SV rises with T) */
  kSvActivationEnergy: ParameterEstimate;
  /** the same for T/eta, J mol^-1: what a diffusion-controlled constant would show */
  diffusionActivationEnergy: number;
  /** viscous flow of the solvent, E_eta = R d ln eta / d(1/T), J mol^-1 */
  viscousFlowActivationEnergy: number;
  /** kSvActivationEnergy / diffusionActivationEnergy */
  stepRatio: number;
  /** K_SV(highest T) / K_SV(lowest T) and the same for T/eta */
  kSvFold: number;
  diffusionFold: number;
  /** Arrhenius and Eyring fits of kq; null when kq is missing at some temperature */
  activation: ActivationFit | null;
  activationNote: string | null;
}

/** "In step with T/eta": the apparent activation energies within a factor of two (our threshold). */
const IN_STEP_LOW = 0.5;
const IN_STEP_HIGH = 2;

/**
 * Reads a temperature series of one emitter–quencher pair in one solvent. Dynamic
 * (collisional) quenching speeds up with temperature as diffusion does, roughly as T/eta;
 * static quenching by a ground-state complex weakens as the complex dissociates on warming
 * (Lakowicz, Principles of Fluorescence Spectroscopy, 3rd ed., 2006, ch. 8). The verdict:
 * - "dynamic" when K_SV rises with T significantly (the slope of ln K_SV against 1/T differs
 *   from zero at the 95 % level) and its apparent activation energy is within a factor of two
 *   of that of T/eta;
 * - "static" when K_SV falls significantly;
 * - "mixed or unclear" otherwise (no significant trend, or a rise out of step with T/eta).
 * kq, when known at every temperature, gets Arrhenius and Eyring fits (fitActivation); the
 * viscous-flow activation energy E_eta of the solvent is given beside Ea, since a
 * diffusion-controlled kq follows the solvent: Ea ≈ E_eta + RT.
 *
 * @param points - one per study, at least 3 distinct temperatures
 * @throws EngineError TOO_FEW_POINTS, NON_POSITIVE_VALUE
 */
export function analyseTemperatureSeries(points: readonly TemperaturePoint[]): TemperatureSeriesAnalysis {
  const temperatures = points.map((p) => p.temperature);
  const distinct = new Set(temperatures).size;
  if (distinct < 3) {
    throw new EngineError(
      'TOO_FEW_POINTS',
      'temperatures',
      `a temperature series needs at least 3 distinct temperatures, got ${distinct}`,
      'Add a study of the same pair in the same solvent at another temperature',
    );
  }
  points.forEach((p, i) => {
    requirePositive(p.temperature, `points[${i}].temperature`);
    requirePositive(p.kSv, `points[${i}].kSv`, 'K_SV must be positive to take its logarithm');
    requirePositive(p.viscosity, `points[${i}].viscosity`);
  });
  const R = GAS_CONSTANT;
  const inverseT = temperatures.map((t) => 1 / t);
  const kSvLine = fitLine(
    inverseT,
    points.map((p) => Math.log(p.kSv)),
  );
  const kSvEnergy = makeEstimate(-R * kSvLine.slope, R * kSvLine.slopeStandardError, kSvLine.degreesOfFreedom);
  const diffusionLine = fitLine(
    inverseT,
    points.map((p) => Math.log(p.temperature / p.viscosity)),
  );
  const viscosityLine = fitLine(
    inverseT,
    points.map((p) => Math.log(p.viscosity)),
  );
  const diffusionEnergy = -R * diffusionLine.slope;
  const viscousFlowEnergy = R * viscosityLine.slope;
  const stepRatio = kSvEnergy.value / diffusionEnergy;

  const byT = [...points].sort((a, b) => a.temperature - b.temperature);
  const cold = byT[0]!;
  const hot = byT[byT.length - 1]!;
  const kSvFold = hot.kSv / cold.kSv;
  const diffusionFold = hot.temperature / hot.viscosity / (cold.temperature / cold.viscosity);

  const tCritical = studentTQuantile975(kSvLine.degreesOfFreedom);
  const significant = Math.abs(kSvEnergy.value) > tCritical * kSvEnergy.standardError;
  const kj = (joules: number) => (joules / 1000).toFixed(1);
  const span = `from ${cold.temperature} K to ${hot.temperature} K`;
  const reasons = [
    `K_SV changes ${kSvFold.toFixed(2)}-fold ${span}; T/η changes ${diffusionFold.toFixed(2)}-fold.`,
    `Apparent activation energy of K_SV ${kj(kSvEnergy.value)} ± ${kj(kSvEnergy.standardError)} kJ/mol against ${kj(diffusionEnergy)} kJ/mol for T/η (ratio ${stepRatio.toFixed(2)}).`,
  ];
  let verdict: TemperatureVerdict;
  if (!significant) {
    verdict = 'mixed-or-unclear';
    reasons.push(
      `The change of K_SV with temperature is within its uncertainty (95 % level, ${kSvLine.degreesOfFreedom} degrees of freedom): no clear trend.`,
    );
  } else if (kSvEnergy.value < 0) {
    verdict = 'static';
    reasons.push(
      'K_SV falls as the temperature rises: a ground-state complex that dissociates on warming (static quenching).',
    );
  } else if (stepRatio >= IN_STEP_LOW && stepRatio <= IN_STEP_HIGH) {
    verdict = 'dynamic';
    reasons.push(
      'K_SV rises with temperature in step with T/η (within a factor of two): collisional (dynamic) quenching.',
    );
  } else {
    verdict = 'mixed-or-unclear';
    reasons.push(
      stepRatio > IN_STEP_HIGH
        ? 'K_SV rises much faster than T/η: an activated step beyond diffusion, or a lifetime that changes with temperature; check tau0 at each temperature.'
        : 'K_SV rises more slowly than T/η: dynamic quenching partly offset by a static part, or a lifetime that shortens on warming.',
    );
  }

  const kqs = points.map((p) => p.kq);
  let activation: ActivationFit | null = null;
  let activationNote: string | null = null;
  if (kqs.every((kq): kq is number => kq !== null && kq > 0)) {
    activation = fitActivation(temperatures, kqs);
  } else {
    activationNote = 'Arrhenius and Eyring fits need kq, so tau0, at every temperature.';
  }
  return {
    verdict,
    reasons,
    kSvActivationEnergy: kSvEnergy,
    diffusionActivationEnergy: diffusionEnergy,
    viscousFlowActivationEnergy: viscousFlowEnergy,
    stepRatio,
    kSvFold,
    diffusionFold,
    activation,
    activationNote,
  };
}
