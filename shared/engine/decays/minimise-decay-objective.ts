import { evaluateDecayModel, type DecayModelSetup, type DecayWorkspace } from './decay-model';
import { invertPositiveDefinite } from './invert-positive-definite';

export interface DecayObjective {
  counts: ArrayLike<number>;
  /** first and last fitted channel (both included) */
  from: number;
  to: number;
  estimator: 'poisson' | 'least-squares';
}

export interface MinimisedDecay {
  parameters: number[];
  /** J^T W J at the optimum: the Fisher information for 'poisson' (W = 1/m), the weighted normal matrix for 'least-squares' */
  information: number[][];
  /** Poisson deviance or weighted sum of squares at the optimum */
  objective: number;
  iterations: number;
  converged: boolean;
}

/** Below this the expected count is treated as this (the weight 1/m stays finite at a zero background). */
const SMALLEST_EXPECTED = 1e-4;
/** Stop when an accepted step lowers the objective by less than this (deviance or chi-squared units). */
const OBJECTIVE_TOLERANCE = 1e-7;

/**
 * Poisson deviance 2 sum(m - c + c ln(c/m)) (Baker & Cousins, Nucl. Instrum. Methods 1984, 221,
 * 437, from memory; minimising it maximises the Poisson likelihood, Bajzer et al., Eur. Biophys.
 * J. 1991, 20, 247, from memory) or weighted squares sum((c - m)^2 / max(c, 1)).
 */
export function decayObjective(objective: DecayObjective, model: ArrayLike<number>): number {
  let total = 0;
  const { counts } = objective;
  for (let i = objective.from; i <= objective.to; i++) {
    const c = counts[i]!;
    const m = model[i]!;
    if (objective.estimator === 'least-squares') {
      total += ((c - m) * (c - m)) / Math.max(c, 1);
    } else if (c > 0) {
      if (!(m > 0)) return Infinity;
      total += 2 * (m - c + c * Math.log(c / m));
    } else total += 2 * m;
  }
  return total;
}

/**
 * Minimises the Poisson deviance (maximum likelihood for counts; Bajzer, Therneau, Sharp &
 * Prendergast, Eur. Biophys. J. 1991, 20, 247, from memory) or the weighted sum of squares of a
 * decay model, by Levenberg–Marquardt steps on the analytic Jacobian: for the likelihood these
 * are Fisher-scoring steps, (J^T W J + lambda diag) delta = -J^T W (m - c) with W = 1/m updated
 * at every step (Marquardt, J. Soc. Ind. Appl. Math. 1963, 11, 431). Parameters on a bound
 * whose gradient points outward are held for that step (a simple active set).
 *
 * @returns the optimum, the information matrix there and whether the fit settled
 */
export function minimiseDecayObjective(
  setup: DecayModelSetup,
  objective: DecayObjective,
  start: readonly number[],
  bounds: { lower: readonly number[]; upper: readonly number[] },
  workspace: DecayWorkspace,
  maxIterations = 300,
): MinimisedDecay {
  const p = start.length;
  const n = setup.channels;
  const clamp = (values: number[]) =>
    values.map((value, k) => Math.min(bounds.upper[k]!, Math.max(bounds.lower[k]!, value)));
  let parameters = clamp([...start]);
  let model = new Float64Array(n);
  let jacobian = Array.from({ length: p }, () => new Float64Array(n));
  let trialModel = new Float64Array(n);
  let trialJacobian = Array.from({ length: p }, () => new Float64Array(n));
  evaluateDecayModel(setup, parameters, model, jacobian, workspace);
  let value = decayObjective(objective, model);
  let damping = 1e-3;
  let iterations = 0;
  let converged = false;
  const gradient = new Array<number>(p);
  const normal = Array.from({ length: p }, () => new Array<number>(p));

  const buildNormalEquations = () => {
    gradient.fill(0);
    for (const row of normal) row.fill(0);
    for (let i = objective.from; i <= objective.to; i++) {
      const c = objective.counts[i]!;
      const m = model[i]!;
      const weight = objective.estimator === 'poisson' ? 1 / Math.max(m, SMALLEST_EXPECTED) : 1 / Math.max(c, 1);
      const residual = weight * (m - c);
      for (let a = 0; a < p; a++) {
        const ja = jacobian[a]![i]!;
        if (ja === 0) continue;
        gradient[a]! += residual * ja;
        const wa = weight * ja;
        const row = normal[a]!;
        for (let b = 0; b <= a; b++) row[b]! += wa * jacobian[b]![i]!;
      }
    }
    for (let a = 0; a < p; a++) for (let b = 0; b < a; b++) normal[b]![a] = normal[a]![b]!;
  };

  for (; iterations < maxIterations; iterations++) {
    buildNormalEquations();
    const held = parameters.map(
      (value, k) => (value <= bounds.lower[k]! && gradient[k]! > 0) || (value >= bounds.upper[k]! && gradient[k]! < 0),
    );
    let accepted = false;
    let trialValue = value;
    for (let attempt = 0; attempt < 40 && !accepted; attempt++) {
      const damped = normal.map((row, a) =>
        row.map((entry, b) => {
          if (held[a] || held[b]) return a === b ? 1 : 0;
          return a === b ? entry * (1 + damping) + 1e-300 : entry;
        }),
      );
      const inverse = invertPositiveDefinite(damped);
      if (!inverse) {
        damping *= 10;
        continue;
      }
      const trial = clamp(
        parameters.map((value, a) => {
          if (held[a]) return value;
          let step = 0;
          for (let b = 0; b < p; b++) if (!held[b]) step -= inverse[a]![b]! * gradient[b]!;
          return value + step;
        }),
      );
      evaluateDecayModel(setup, trial, trialModel, trialJacobian, workspace);
      trialValue = decayObjective(objective, trialModel);
      if (trialValue <= value) {
        accepted = true;
        parameters = trial;
      } else damping *= 10;
    }
    if (!accepted) {
      // No step lowers the objective any more: the optimum within rounding.
      converged = true;
      break;
    }
    const decrease = value - trialValue;
    [model, trialModel] = [trialModel, model];
    [jacobian, trialJacobian] = [trialJacobian, jacobian];
    value = trialValue;
    damping = Math.max(damping / 10, 1e-12);
    if (decrease < OBJECTIVE_TOLERANCE && damping < 1) {
      converged = true;
      iterations++;
      break;
    }
  }
  buildNormalEquations();
  return {
    parameters,
    information: normal.map((row) => [...row]),
    objective: value,
    iterations,
    converged,
  };
}
