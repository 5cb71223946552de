import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { SpectrumMatrix } from '@shared/schemas/spectrum-matrices';
import { MatrixChanges } from '@/features/mechanism/components/matrix-changes';
import { answerFetch, errorAnswer, renderWithClient } from './support/render';

// Only the parts MatrixChanges reads; the rest of a kept matrix does not matter here.
const matrix = { id: 'm-1', title: 'spectra.csv', analysis: { bandWidth: 10 } } as unknown as SpectrumMatrix;

describe('MatrixChanges (analyse a kept matrix again, or discard it)', () => {
  it('when analysed again, then the new band width is sent and the verdict before and after is said', async () => {
    const calls = answerFetch({
      matrix: { ...matrix, analysis: { bandWidth: 5 } },
      verdict: { before: 'two-emitters', after: 'unclear', reasons: [] },
    });
    renderWithClient(<MatrixChanges labId="l" studyId="s" matrix={matrix} onDiscarded={() => {}} />);
    const field = screen.getByLabelText('New band width (nm)', { exact: false });
    await userEvent.clear(field);
    await userEvent.type(field, '5');
    await userEvent.click(screen.getByRole('button', { name: 'Analyse again' }));
    expect((await screen.findByRole('status')).textContent).toMatch(
      /Analysed again in 5 nm bands\. The mechanism verdict moved from Two emitters or an exciplex to Unclear\./,
    );
    expect(calls[0]).toMatchObject({
      url: '/api/labs/l/studies/s/spectrum-matrices/m-1/reanalyse',
      method: 'POST',
      body: { bandWidth: 5 },
    });
  });

  it('when a band width is refused, then the reason shows and no verdict is claimed', async () => {
    answerFetch(errorAnswer(400, 'invalid_input', 'bandWidth: must be at most 100 nm', []));
    renderWithClient(<MatrixChanges labId="l" studyId="s" matrix={matrix} onDiscarded={() => {}} />);
    await userEvent.click(screen.getByRole('button', { name: 'Analyse again' }));
    expect((await screen.findByRole('alert')).textContent).toMatch(/at most 100 nm/);
    expect(screen.queryByRole('status')).toBeNull();
  });

  it('when Discard is pressed, then nothing is sent until the second, named button confirms', async () => {
    const calls = answerFetch({ verdict: { before: 'two-emitters', after: 'unclear', reasons: [] } });
    const discarded: unknown[] = [];
    renderWithClient(
      <MatrixChanges labId="l" studyId="s" matrix={matrix} onDiscarded={(change) => discarded.push(change)} />,
    );
    await userEvent.click(screen.getByRole('button', { name: 'Discard these spectra' }));
    expect(calls).toEqual([]);
    await userEvent.click(screen.getByRole('button', { name: 'Keep them' }));
    await userEvent.click(screen.getByRole('button', { name: 'Discard these spectra' }));
    await userEvent.click(screen.getByRole('button', { name: 'Discard spectra.csv and its file' }));
    await waitFor(() => expect(discarded).toHaveLength(1));
    expect(calls[0]).toMatchObject({ url: '/api/labs/l/studies/s/spectrum-matrices/m-1', method: 'DELETE' });
    expect(discarded).toEqual([{ before: 'two-emitters', after: 'unclear', reasons: [] }]);
  });
});
