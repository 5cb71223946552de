import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { DecayModel } from '@shared/schemas/decays';
import { DecayModelPicker } from '@/features/decays/components/decay-model-picker';

const model: DecayModel = {
  components: 1,
  method: 'tail',
  estimator: 'poisson',
  startChannel: null,
  endChannel: null,
};

describe('DecayModelPicker', () => {
  it('when the choices change, then the model handed back has a number of exponentials and null for an automatic fit', async () => {
    const models: DecayModel[] = [];
    render(<DecayModelPicker model={model} onChange={(next) => models.push(next)} />);
    await userEvent.selectOptions(screen.getByLabelText('Exponentials'), '2');
    await userEvent.selectOptions(screen.getByLabelText('Fit'), 'automatic');
    await userEvent.selectOptions(screen.getByLabelText('Estimator'), 'weighted least squares');
    expect(models).toEqual([
      { ...model, components: 2 },
      { ...model, method: null },
      { ...model, estimator: 'least-squares' },
    ]);
  });
});
