import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { AbsorptionTitration } from '@shared/schemas/absorption-titrations';
import { TitrationChanges } from '@/features/mechanism/components/titration-changes';
import { answerFetch, renderWithClient } from './support/render';

// Only the parts TitrationChanges reads; the rest of a kept titration does not matter here.
const titration = {
  id: 't-1',
  title: 'uv-vis.csv',
  quencherFile: null,
  options: {
    bandWidth: 5,
    pathLength: 1,
    emitterConcentration: 2e-5,
    subtractQuencher: false,
    associationFit: 'isotherm',
  },
} as unknown as AbsorptionTitration;

describe('TitrationChanges (analyse a kept absorption titration again)', () => {
  it('when opened, then the kept settings stand in the fields, [E]0 in µM as a person would type it', () => {
    renderWithClient(<TitrationChanges labId="l" studyId="s" titration={titration} onDiscarded={() => {}} />);
    expect(screen.getByLabelText<HTMLInputElement>('New band width (nm)').value).toBe('5');
    expect(screen.getByLabelText<HTMLInputElement>('New path length (cm)').value).toBe('1');
    // 2e-5 M is 20 µM (SI prefixes, common practice); 2e-5 * 1e6 is 20.000000000000004 in floating point
    expect(screen.getByLabelText<HTMLInputElement>('New emitter concentration (µM)').value).toBe('20');
  });

  it('when new settings are typed, then they are sent in SI units, an empty [E]0 as null', async () => {
    const calls = answerFetch({ titration, verdict: { before: 'static', after: 'unclear', reasons: [] } });
    renderWithClient(<TitrationChanges labId="l" studyId="s" titration={titration} onDiscarded={() => {}} />);
    await userEvent.clear(screen.getByLabelText('New band width (nm)'));
    await userEvent.type(screen.getByLabelText('New band width (nm)'), '2,5');
    await userEvent.clear(screen.getByLabelText('New path length (cm)'));
    await userEvent.type(screen.getByLabelText('New path length (cm)'), '0.5');
    await userEvent.clear(screen.getByLabelText('New emitter concentration (µM)'));
    await userEvent.click(screen.getByRole('button', { name: 'Analyse the titration again' }));
    await waitFor(() => expect(calls).toHaveLength(1));
    expect(calls[0]).toMatchObject({
      url: '/api/labs/l/studies/s/absorption-titrations/t-1/reanalyse',
      method: 'POST',
      body: {
        bandWidth: 2.5,
        pathLength: 0.5,
        emitterConcentration: null,
        subtractQuencher: false,
        associationFit: 'isotherm',
      },
    });
  });
});
