import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import type { RedoxPotentialRecord } from '@shared/schemas/library-measurements';
import { EnergyForm } from '@/features/library/components/energy-form';
import { LifetimeForm } from '@/features/library/components/lifetime-form';
import { PotentialForm } from '@/features/library/components/potential-form';
import { answerFetch, errorAnswer, renderWithClient } from './support/render';
import { labId } from './support/study-fixture';

const compoundId = '11111111-1111-4111-8111-111111111111';
const base = `/api/labs/${labId}/compounds/${compoundId}`;

describe('library measurement forms (one form built from each field description)', () => {
  it('when a lifetime is typed in µs, then seconds go to the server and only the numbers are cleared', async () => {
    const calls = answerFetch({});
    renderWithClient(<LifetimeForm labId={labId} compoundId={compoundId} defaultSolvent="acetonitrile" />);
    const form = screen.getByRole('form', { name: 'Add a lifetime' });
    await userEvent.type(screen.getByLabelText('Lifetime'), '1,1');
    await userEvent.type(screen.getByLabelText('Uncertainty (1 s.d.)'), '0.05');
    await userEvent.selectOptions(screen.getByLabelText('Unit'), 'µs');
    await userEvent.type(screen.getByLabelText('Method'), 'TCSPC');
    await userEvent.click(screen.getByRole('button', { name: 'Save lifetime' }));
    await waitFor(() => expect(screen.getByLabelText<HTMLInputElement>('Lifetime').value).toBe(''));
    expect(calls).toEqual([
      {
        url: `${base}/lifetimes`,
        method: 'POST',
        body: {
          value: 1.1e-6,
          uncertainty: 5e-8,
          solvent: 'acetonitrile',
          atmosphere: 'argon',
          temperature: 298.15,
          method: 'TCSPC',
          source: null, // the shared schema turns an empty source into null
        },
      },
    ]);
    expect(screen.getByLabelText<HTMLInputElement>('Method').value).toBe('TCSPC');
    expect(form).toBeTruthy();
  });

  it('when the server refuses a value it names in seconds, then the message stands beside the field as typed', async () => {
    answerFetch(
      errorAnswer(400, 'validation_failed', 'Check the fields.', [
        { path: 'body.value', message: 'must be at most 1 s' },
      ]),
    );
    renderWithClient(<LifetimeForm labId={labId} compoundId={compoundId} defaultSolvent="acetonitrile" />);
    await userEvent.type(screen.getByLabelText('Lifetime'), '5');
    await userEvent.type(screen.getByLabelText('Method'), 'TCSPC');
    await userEvent.click(screen.getByRole('button', { name: 'Save lifetime' }));
    expect(await screen.findByText(/must be at most 1 s/)).toBeTruthy();
    expect(screen.getByLabelText('Lifetime').getAttribute('aria-invalid')).toBe('true');
  });

  it('when E00 is typed as a wavelength, then the converted energy is previewed and the wavelength is sent', async () => {
    const calls = answerFetch({});
    renderWithClient(<EnergyForm labId={labId} compoundId={compoundId} />);
    await userEvent.selectOptions(screen.getByLabelText('Entered as'), 'nm');
    await userEvent.type(screen.getByLabelText('E00'), '450');
    // 1239.84198 / 450 = 2.7552 eV (E = hc/λ with CODATA hc/e).
    expect(screen.getByText('= 2.755 eV')).toBeTruthy();
    await userEvent.type(screen.getByLabelText('How it was obtained'), 'emission onset at 77 K');
    await userEvent.click(screen.getByRole('button', { name: 'Save E00' }));
    await waitFor(() => expect(calls).toHaveLength(1));
    expect(calls[0]?.body).toEqual({ wavelength: 450, method: 'emission onset at 77 K', source: null });
  });

  it('when a potential is corrected, then the change goes to that record with the version read', async () => {
    const existing: RedoxPotentialRecord = {
      id: '33333333-3333-4333-8333-333333333333',
      compoundId,
      couple: 'reduction',
      value: -1.33,
      reference: 'SCE',
      solvent: 'acetonitrile',
      electrolyte: null,
      kind: 'half-wave',
      source: null,
      notes: '',
      createdById: null,
      createdByName: null,
      version: 2,
      createdAt: '2026-03-01T10:00:00.000Z',
      updatedAt: '2026-03-01T10:00:00.000Z',
    } as RedoxPotentialRecord;
    const calls = answerFetch({});
    const done = vi.fn();
    renderWithClient(
      <PotentialForm
        labId={labId}
        compoundId={compoundId}
        defaultSolvent="acetonitrile"
        existing={existing}
        onDone={done}
      />,
    );
    const value = screen.getByLabelText('Potential (V)');
    await userEvent.clear(value);
    await userEvent.type(value, '-1.35');
    await userEvent.click(screen.getByRole('button', { name: 'Save changes' }));
    await waitFor(() => expect(done).toHaveBeenCalledOnce());
    expect(calls[0]?.method).toBe('PATCH');
    expect(calls[0]?.url).toBe(`${base}/potentials/${existing.id}`);
    expect(calls[0]?.body).toMatchObject({ value: -1.35, couple: 'reduction', version: 2 });
  });
});
