import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { ENGINE_VERSION } from '@shared/engine';
import { fitStudy } from '@shared/engine/study-fit';
import { fitParameterLines, formatEstimate, rSquaredLines, weightingText } from '@shared/format';
import { pointAt } from '@shared/schemas/study-points';
import type { StudyFit } from '@shared/schemas/study-fits';
import { ResultsPanel } from '@/features/studies/components/results-panel';
import { renderWithClient } from './support/render';
import { studyDetail } from './support/study-fixture';

// Invented demo-style readings (not measurements): four concentrations, so the engine flags them as few.
const readings: Array<[number, number]> = [
  [0, 1000],
  [0.002, 712],
  [0.004, 560],
  [0.006, 449],
];

/** A fit as the server stores it: the engine's outcome for the fixture study, with its stamp. */
function storedFit(): StudyFit {
  const points = readings.map(([concentration, intensity], position) => ({
    ...pointAt(concentration),
    intensity,
    position,
  }));
  return {
    id: '3e1f0a2b-5c6d-4e7f-8a9b-0c1d2e3f4a5b',
    ...fitStudy(studyDetail(), points, 'linear-free'),
    weighting: 'unweighted',
    trigger: 'manual',
    engineVersion: ENGINE_VERSION,
    createdBy: 'Ada Example',
    createdAt: '2026-03-01T10:00:00.000Z',
  };
}

describe('ResultsPanel', () => {
  it('when a fit is shown, then every estimate reads as the formatter writes it, with R² and the engine version', () => {
    const fit = storedFit();
    renderWithClient(<ResultsPanel fit={fit} />);
    const { lines } = fitParameterLines(fit.model, fit.result);
    const shown = lines.filter((line) => line.estimate);
    expect(shown.length).toBeGreaterThan(1);
    for (const line of shown) {
      const { value, standardError } = line.estimate!;
      expect(screen.getByLabelText(line.label).textContent).toContain(formatEstimate(value, standardError, line.unit));
    }
    for (const line of rSquaredLines(fit.result.statistics)) {
      expect(screen.getByText(`${line.label} = ${line.value.toFixed(4)}`, { exact: false })).toBeTruthy();
    }
    expect(screen.getByText(`engine ${ENGINE_VERSION}`, { exact: false })).toBeTruthy();
    expect(screen.getByLabelText('Weighting').textContent).toBe(
      `Weighting: ${weightingText(fit.result.weighting)}`, // 'unweighted least squares'
    );
  });

  it('when the engine raised flags, then each one shows its title, what to do and what to check', () => {
    const fit = storedFit();
    expect(fit.result.flags.map((flag) => flag.code)).toContain('FEW_CONCENTRATIONS');
    renderWithClient(<ResultsPanel fit={fit} />);
    const list = screen.getByRole('list', { name: 'Flags' });
    for (const flag of fit.result.flags) {
      const item = within(list).getByText(flag.title, { exact: false }).closest('li')!;
      expect(item.textContent).toContain(flag.whatToDo!);
      expect(item.textContent).toContain(`Check: ${flag.whatToCheck.join('; ')}.`);
    }
  });

  it('when the study holds lifetimes only, then the panel says "no intensity data" and K_SV reads as the lifetime line', () => {
    // tau = 1 µs / (1 + 500 [Q]) (Lakowicz 3rd ed. eq. 8.2, numbers constructed): K_SV = 500 M^-1 by hand.
    const points = [0, 1e-3, 2e-3, 3e-3].map((concentration, position) => ({
      ...pointAt(concentration),
      lifetime: 1e-6 / (1 + 500 * concentration),
      position,
    }));
    const fit: StudyFit = { ...storedFit(), ...fitStudy(studyDetail(), points, 'linear-free') };
    renderWithClient(<ResultsPanel fit={fit} />);
    expect(screen.getByLabelText('Intensity fit').textContent).toBe(
      'Intensity fit: no intensity data. K_SV and kq come from the lifetime Stern–Volmer fit (τ0/τ).',
    );
    expect(screen.getByLabelText('K_SV from lifetimes (τ0/τ)').textContent).toMatch(/^500(\.0*)? ± /);
    expect(screen.queryByText(/series cannot be fitted/)).toBeNull();
  });
});
