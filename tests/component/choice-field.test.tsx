import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { ChoiceField } from '@/components/choice-field';

const choices = [
  { value: 'poisson', label: 'Poisson likelihood' },
  { value: 'least-squares', label: 'weighted least squares' },
] as const;

describe('ChoiceField', () => {
  it('when a choice is picked, then its value is handed back and the labels are what the list shows', async () => {
    const picked: string[] = [];
    render(
      <ChoiceField label="Estimator" value="poisson" choices={choices} onChange={(value) => picked.push(value)} />,
    );
    const select = screen.getByLabelText<HTMLSelectElement>('Estimator');
    expect([...select.options].map((option) => option.text)).toEqual(['Poisson likelihood', 'weighted least squares']);
    await userEvent.selectOptions(select, 'weighted least squares');
    expect(picked).toEqual(['least-squares']);
  });
});
