import { useState } from 'react';
import { fitModels, fitWeightingNames, fitWeightings, type FitModel, type FitWeighting } from '@shared/schemas/studies';
import { Button } from '@/components/button';
import { ChoiceField } from '@/components/choice-field';
import { FormAlert } from '@/components/form-alert';
import { describeError } from '@/lib/form-errors';
import { useRunFit } from '../api/run-fit';
import { modelLabels } from './format';

const MODEL_CHOICES = fitModels.map((value) => ({ value, label: modelLabels[value] }));
const WEIGHTING_CHOICES = fitWeightings.map((value) => ({ value, label: fitWeightingNames[value] }));

/** Fit now with another model or weighting; every fit is kept. */
export function FitControls({
  labId,
  studyId,
  model,
  weighting,
}: {
  labId: string;
  studyId: string;
  model: FitModel;
  weighting: FitWeighting;
}) {
  const [chosen, setChosen] = useState<FitModel>(model);
  const [weights, setWeights] = useState<FitWeighting>(weighting);
  const run = useRunFit(labId, studyId);
  return (
    <div className="space-y-1">
      <div className="flex flex-wrap items-end gap-2">
        <ChoiceField label="Model" value={chosen} choices={MODEL_CHOICES} onChange={setChosen} />
        <ChoiceField label="Weighting" value={weights} choices={WEIGHTING_CHOICES} onChange={setWeights} />
        <Button
          variant="quiet"
          onClick={() => run.mutate({ model: chosen, weighting: weights })}
          pending={run.isPending}
          pendingLabel="Fitting…"
        >
          Fit with these choices
        </Button>
      </div>
      <p className="text-caption text-ink-500">
        Weighted: 1/σ² of each I0/I, σ from the readings’ own uncertainties, else from the scatter of replicate runs at
        each [Q]; straight-line models only.
      </p>
      {run.isError && <FormAlert>{describeError(run.error)}</FormAlert>}
    </div>
  );
}
