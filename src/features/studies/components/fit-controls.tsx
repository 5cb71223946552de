import { useState } from 'react';
import { fitModels, fitWeightingNames, fitWeightings, type FitModel, type FitWeighting } from '@shared/schemas/studies';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { SelectField } from '@/components/select-field';
import { describeError } from '@/lib/form-errors';
import { useRunFit } from '../api/run-fit';
import { modelLabels } from './format';

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
        <SelectField
          label="Model"
          value={chosen}
          onChange={(event) => setChosen(event.target.value as FitModel)}
          options={fitModels.map((value) => ({ value, label: modelLabels[value] }))}
        />
        <SelectField
          label="Weighting"
          value={weights}
          onChange={(event) => setWeights(event.target.value as FitWeighting)}
          options={fitWeightings.map((value) => ({ value, label: fitWeightingNames[value] }))}
        />
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
