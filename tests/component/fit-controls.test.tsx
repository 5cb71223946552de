import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { FitControls } from '@/features/studies/components/fit-controls';
import { answerFetch, renderWithClient } from './support/render';
import { labId, studyDetail } from './support/study-fixture';

describe('FitControls', () => {
  it('when the weighted fit is chosen, then the request carries the model and the weighting', async () => {
    const study = studyDetail();
    const calls = answerFetch({});
    renderWithClient(<FitControls labId={labId} studyId={study.id} model="linear-fixed" weighting="unweighted" />);
    expect(screen.getByLabelText<HTMLSelectElement>('Weighting').value).toBe('unweighted');
    await userEvent.selectOptions(screen.getByLabelText('Weighting'), 'weighted');
    await userEvent.click(screen.getByRole('button', { name: 'Fit with these choices' }));
    await waitFor(() => expect(calls).toHaveLength(1));
    expect(calls[0]).toMatchObject({
      method: 'POST',
      url: `/api/labs/${labId}/studies/${study.id}/fits`,
      body: { model: 'linear-fixed', weighting: 'weighted' },
    });
  });
});
