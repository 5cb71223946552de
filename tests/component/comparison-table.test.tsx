import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Comparison } from '@shared/schemas/comparisons';
import { ComparisonTable } from '@/features/comparisons/components/comparison-table';
import { renderWithClient } from './support/render';

// Invented rows (demo-like data): only the headings and cells' forms are checked here.
const comparison: Comparison = {
  side: 'emitter',
  compound: { id: 'c1', name: 'Test emitter' },
  rows: [
    {
      studyId: 's1',
      title: 'Test study',
      partner: { id: 'q1', name: 'Test quencher' },
      solvent: 'acetonitrile',
      status: 'approved',
      kq: { value: 1.2e9, standardError: 4e7 },
      kSv: { value: 2290, standardError: 80 },
      flags: [],
      drivingForce: { pathway: 'oxidative', electronvolts: -0.57, withWorkTerm: -0.63 },
      drivingForceMissing: null,
      mechanism: 'static',
      temperature: 298.15,
      diffusionLimit: { value: 1.93e10, basis: 'acetonitrile at 298.15 K', note: null },
    },
  ],
  trends: [],
  engineVersion: 'test',
};

describe('ComparisonTable', () => {
  it('when drawn, then the driving-force heading is ΔG with ET lowered as a subscript, not ΔG_ET', () => {
    renderWithClient(<ComparisonTable comparison={comparison} labId="lab" />);
    const table = screen.getByRole('table', { name: 'Studies of Test emitter' });
    const heading = within(table).getByRole('columnheader', { name: /^ΔG\s*ET \(eV\)$/ });
    expect(heading.querySelector('sub')?.textContent).toBe('ET');
    expect(table.textContent).not.toContain('ΔG_ET');
  });

  it("when drawn, then each row names its study's mechanism verdict in words under a Mechanism heading", () => {
    renderWithClient(<ComparisonTable comparison={comparison} labId="lab" />);
    const table = screen.getByRole('table', { name: 'Studies of Test emitter' });
    const headings = within(table).getAllByRole('columnheader');
    const column = headings.findIndex((heading) => heading.textContent === 'Mechanism');
    expect(column).toBeGreaterThan(0);
    const row = within(table).getAllByRole('row')[1]!;
    const cells = [within(row).getByRole('rowheader'), ...within(row).getAllByRole('cell')];
    expect(cells[column]?.textContent).toBe('Static (ground-state complex)');
  });
});
