import type { DecayCurves, DecayOutcome } from '@shared/schemas/decays';
import { FormAlert } from '@/components/form-alert';
import { describeError } from '@/lib/form-errors';
import { DecayParameters } from './decay-parameters';
import { DecayPlot } from './decay-plot';

interface DecayFitProps {
  /** the curves to draw; until they arrive the plot's place says "Drawing…" */
  curves: DecayCurves | undefined;
  /** the fitted decay whose parameters stand beside the plot */
  outcome: DecayOutcome | undefined;
  /** what the saved figures are named after (the study or the compound) */
  title: string;
  /** why the curves could not be drawn, said in place of the plot */
  error?: unknown;
}

/** One decay with its fit, beside the fitted parameters (a preview, a kept set or a kept library decay). */
export function DecayFit({ curves, outcome, title, error }: DecayFitProps) {
  return (
    <div className="grid grid-cols-1 gap-4 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
      {curves ? (
        <DecayPlot curves={curves} title={title} />
      ) : error ? (
        <FormAlert>{describeError(error)}</FormAlert>
      ) : (
        <p className="text-body">Drawing…</p>
      )}
      {outcome && <DecayParameters outcome={outcome} />}
    </div>
  );
}
