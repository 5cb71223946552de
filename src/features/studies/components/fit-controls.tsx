import { useState } from 'react';
import { fitModels, type FitModel } from '@shared/schemas/studies';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { SelectField } from '@/components/select-field';
import { describeError } from '@/lib/form-errors';
import { useRunFit } from '../api/run-fit';
import { modelLabels } from './format';

/** Fit now with another model; every fit is kept. */
export function FitControls({ labId, studyId, model }: { labId: string; studyId: string; model: FitModel }) {
  const [chosen, setChosen] = useState<FitModel>(model);
  const run = useRunFit(labId, studyId);
  return (
    <div className="flex flex-wrap items-end gap-2">
      <SelectField
        label="Model"
        value={chosen}
        onChange={(event) => setChosen(event.target.value as FitModel)}
        options={fitModels.map((value) => ({ value, label: modelLabels[value] }))}
      />
      <Button variant="quiet" onClick={() => run.mutate(chosen)} pending={run.isPending} pendingLabel="Fitting…">
        Fit with this model
      </Button>
      {run.isError && <FormAlert>{describeError(run.error)}</FormAlert>}
    </div>
  );
}
