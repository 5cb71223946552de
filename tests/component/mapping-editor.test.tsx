import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { useState } from 'react';
import { describe, expect, it, vi } from 'vitest';
import type { SeriesMapping, SpectrumMapping, UploadMapping } from '@shared/schemas/study-uploads';
import { MappingEditor } from '@/features/studies/components/mapping-editor';

const series: SeriesMapping = {
  layout: 'series',
  concentration: 0,
  concentrationUnit: 'mM',
  intensity: 1,
  intensityIsRatio: false,
  lifetime: null,
  lifetimeUnit: 'ns',
  absorbanceExcitation: null,
  absorbanceEmission: null,
  volumeAdded: null,
  volumeUnit: 'uL',
  uncertainty: null,
  run: null,
  moreIntensities: [],
};

/** Holds the mapping as the upload panel does, so each change shows on screen; `seen` gets every change. */
function Editor({
  headers,
  start,
  seen,
}: {
  headers: string[];
  start: UploadMapping;
  seen: (m: UploadMapping) => void;
}) {
  const [mapping, setMapping] = useState(start);
  return (
    <MappingEditor
      headers={headers}
      mapping={mapping}
      onChange={(next) => {
        seen(next);
        setMapping(next);
      }}
    />
  );
}

describe('MappingEditor', () => {
  const headers = ['[Q] / mM', 'I (counts)', 'tau / ns'];

  it('when a table holds several runs, then the chemist names a run column or ticks one intensity column per further run', async () => {
    const seen = vi.fn();
    render(<Editor headers={[...headers, 'I run 2', 'run']} start={series} seen={seen} />);
    await userEvent.selectOptions(screen.getByLabelText('Run column (replicate runs)'), '5: run');
    expect(seen).toHaveBeenLastCalledWith({ ...series, run: 4 });
    await userEvent.selectOptions(screen.getByLabelText('Run column (replicate runs)'), '— none —');
    await userEvent.click(screen.getByRole('checkbox', { name: '4: I run 2' }));
    expect(seen).toHaveBeenLastCalledWith({ ...series, run: null, moreIntensities: [3] });
    expect(screen.getByText(/\(run 2\)/)).toBeTruthy();
    // the concentration and run-1 intensity columns cannot also be further runs
    expect(screen.getByRole<HTMLInputElement>('checkbox', { name: '2: I (counts)' }).disabled).toBe(true);
  });

  it('when a series file is mapped, then each role offers the file’s columns and the concentration cannot be left out', () => {
    render(<Editor headers={headers} start={series} seen={vi.fn()} />);
    const options = (label: string) =>
      within(screen.getByLabelText(label))
        .getAllByRole('option')
        .map((option) => option.textContent);
    expect(options('Concentration column')).toEqual(['1: [Q] / mM', '2: I (counts)', '3: tau / ns']);
    expect(options('Lifetime column')).toEqual(['— none —', '1: [Q] / mM', '2: I (counts)', '3: tau / ns']);
    expect(screen.getByLabelText<HTMLSelectElement>('Intensity or I0/I column').value).toBe('1');
  });

  it('when a column and a unit are chosen, then the mapping changes only there', async () => {
    const seen = vi.fn();
    render(<Editor headers={headers} start={series} seen={seen} />);
    await userEvent.selectOptions(screen.getByLabelText('Lifetime column'), '3: tau / ns');
    expect(seen).toHaveBeenLastCalledWith({ ...series, lifetime: 2 });
    await userEvent.selectOptions(screen.getByLabelText('Lifetime unit'), 'us');
    expect(seen).toHaveBeenLastCalledWith({ ...series, lifetime: 2, lifetimeUnit: 'us' });
    await userEvent.selectOptions(screen.getByLabelText('Intensity or I0/I column'), '— none —');
    expect(seen).toHaveBeenLastCalledWith({ ...series, lifetime: 2, lifetimeUnit: 'us', intensity: null });
    await userEvent.click(screen.getByLabelText('Column holds I0/I ratios'));
    expect(seen).toHaveBeenLastCalledWith({
      ...series,
      lifetime: 2,
      lifetimeUnit: 'us',
      intensity: null,
      intensityIsRatio: true,
    });
  });

  it('when a spectrum matrix is mapped, then the reduction switches between a window and one wavelength', async () => {
    const spectrum: SpectrumMapping = {
      layout: 'spectrum',
      wavelength: 0,
      samples: [
        { column: 1, concentration: 0 },
        { column: 2, concentration: 0.002 },
      ],
      reduction: { kind: 'window', start: 560, end: 680 },
      baseline: null,
    };
    const seen = vi.fn();
    render(<Editor headers={['nm', '0 mM', '2 mM', 'unknown']} start={spectrum} seen={seen} />);
    expect(screen.getByText(/Spectra: 2 of 3 have a quencher concentration/)).toBeTruthy();
    expect(screen.getByLabelText<HTMLInputElement>('From (nm)').value).toBe('560');
    await userEvent.selectOptions(screen.getByLabelText('Reduce each spectrum by'), 'reading one wavelength');
    expect(seen).toHaveBeenLastCalledWith({ ...spectrum, reduction: { kind: 'wavelength', at: 0 } });
    expect(screen.queryByLabelText('From (nm)')).toBeNull();
    await userEvent.type(screen.getByLabelText('At (nm)'), '615');
    expect(seen).toHaveBeenLastCalledWith({ ...spectrum, reduction: { kind: 'wavelength', at: 615 } });
    await userEvent.click(screen.getByLabelText('Subtract a baseline'));
    await userEvent.clear(screen.getByLabelText('Baseline from (nm)'));
    await userEvent.type(screen.getByLabelText('Baseline from (nm)'), '750');
    await userEvent.clear(screen.getByLabelText('Baseline to (nm)'));
    await userEvent.type(screen.getByLabelText('Baseline to (nm)'), '800');
    expect(seen).toHaveBeenLastCalledWith({
      ...spectrum,
      reduction: { kind: 'wavelength', at: 615 },
      baseline: { start: 750, end: 800 },
    });
  });

  it('when the file names no concentration unit, then the unit reads "choose" until one is picked', async () => {
    const seen = vi.fn();
    const open = { ...series, concentrationUnit: null };
    render(<Editor headers={headers} start={open} seen={seen} />);
    const unit = screen.getByLabelText<HTMLSelectElement>('Concentration unit');
    expect(unit.value).toBe('');
    expect(within(unit).getAllByRole('option')[0]!.textContent).toBe('— choose —');
    await userEvent.selectOptions(unit, 'mM');
    expect(seen).toHaveBeenLastCalledWith({ ...open, concentrationUnit: 'mM' });
  });
});
