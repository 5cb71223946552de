import { decayWorkspace, evaluateDecayModel } from './decay-model';
import type { DecayFit, DecayInput } from './decay-types';
import { prepareResponse } from './prepare-response';
import { residualAutocorrelation } from './residual-autocorrelation';

export interface DecayCurves {
  /** expected counts per channel over the whole record (tail fit: null before the start channel) */
  model: Array<number | null>;
  /** (c - m)/sqrt(m) over the fitted channels, from fit.startChannel */
  weightedResiduals: number[];
  /** autocorrelation of the weighted residuals, lags 0 .. half the fitted channels */
  autocorrelation: number[];
}

/**
 * The curves a decay plot needs, drawn again from a stored fit's exact parameters: the fitted
 * curve, the weighted residuals (c - m)/sqrt(m) and their autocorrelation (Lakowicz, 3rd ed.,
 * 2006, ch. 4; O'Connor & Phillips, 1984, ch. 6). Cheap (one model evaluation), so fits are
 * stored without their curves.
 *
 * @param input - the same counts, channel width and response the fit was made from
 * @param fit - the fit (method, parameters, range, number of components)
 * @example decayCurves(input, fitDecay(input)).weightedResiduals.length // endChannel - startChannel + 1
 */
export function decayCurves(
  input: DecayInput,
  fit: Pick<DecayFit, 'method' | 'parameters' | 'startChannel' | 'endChannel' | 'components'>,
): DecayCurves {
  const n = input.counts.length;
  const response = fit.method === 'reconvolution' && input.response ? prepareResponse(input.response).response : null;
  const model = new Float64Array(n);
  evaluateDecayModel(
    {
      method: fit.method,
      components: fit.components.length,
      channels: n,
      response,
      origin: fit.method === 'tail' ? fit.startChannel : 0,
      end: n - 1,
    },
    fit.parameters,
    model,
    null,
    decayWorkspace(n),
  );
  const weightedResiduals: number[] = [];
  for (let i = fit.startChannel; i <= fit.endChannel; i++) {
    const m = Math.max(model[i]!, 1e-4);
    weightedResiduals.push((input.counts[i]! - m) / Math.sqrt(m));
  }
  const first = fit.method === 'tail' ? fit.startChannel : 0;
  return {
    model: Array.from(model, (value, i) => (i < first ? null : value)),
    weightedResiduals,
    autocorrelation: residualAutocorrelation(weightedResiduals),
  };
}
