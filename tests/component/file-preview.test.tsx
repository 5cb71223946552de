import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { useState } from 'react';
import { describe, expect, it } from 'vitest';
import type { FileReading } from '@shared/schemas/file-reading';
import type { SeriesMapping, UploadQuestionCode } from '@shared/schemas/study-uploads';
import { FilePreview } from '@/features/studies/components/file-preview';
import { point } from './support/study-fixture';
import { allAcknowledged } from '@/features/studies/components/upload-questions';

const mapping: SeriesMapping = {
  layout: 'series',
  concentration: 0,
  concentrationUnit: 'M',
  intensity: 1,
  intensityIsRatio: false,
  lifetime: null,
  lifetimeUnit: 's',
  absorbanceExcitation: null,
  absorbanceEmission: null,
  volumeAdded: null,
  volumeUnit: 'L',
  uncertainty: null,
  run: null,
  moreIntensities: [],
};
// Invented reading: [Q] 0-8 read as M, the two questions the server asks of it.
const reading: Omit<FileReading, 'fileName' | 'size'> = {
  format: 'comma-separated text',
  headers: ['[Q]', 'intensity'],
  rows: [
    ['0', '1000'],
    ['8', '333.3'],
  ],
  rowCount: 2,
  mapping,
  points: [point(0, 0, 1000), point(1, 8, 333.3)],
  pointCount: 2,
  problems: [],
  warnings: [],
  questions: [
    { code: 'concentration_above_1_molar', message: 'The highest concentration reads as 8 M.' },
    { code: 'ksv_below_1_per_molar', message: 'These points give K_SV of about 0.25 M⁻¹.' },
  ],
};

function Preview({ start }: { start: typeof reading }) {
  const [acknowledged, setAcknowledged] = useState<UploadQuestionCode[]>([]);
  return (
    <>
      <FilePreview
        fileName="unitless.csv"
        reading={start}
        mapping={start.mapping!}
        onMapping={() => undefined}
        acknowledged={acknowledged}
        onAcknowledged={setAcknowledged}
      />
      <output aria-label="ready">{String(allAcknowledged(start, acknowledged))}</output>
    </>
  );
}

describe('FilePreview', () => {
  it('when the points come in two runs, then the preview says so and names each point’s run', () => {
    const twoRuns = {
      ...reading,
      questions: [],
      points: [point(0, 0, 1000), { ...point(1, 0, 800), series: 2 }],
    };
    render(<Preview start={twoRuns} />);
    expect(screen.getByLabelText('Points from the file').textContent).toMatch(
      /2 points in 2 runs.*run 1: 0 → 1000.*run 2: 0 → 800/,
    );
  });

  it('when the points raise questions, then each is a tick box and the points are ready only when both are ticked', async () => {
    render(<Preview start={reading} />);
    expect(screen.getByRole('group', { name: 'Check before using these points' })).toBeTruthy();
    expect(screen.getByLabelText('ready').textContent).toBe('false');
    await userEvent.click(screen.getByRole('checkbox', { name: /reads as 8 M/ }));
    expect(screen.getByLabelText('ready').textContent).toBe('false');
    await userEvent.click(screen.getByRole('checkbox', { name: /0\.25 M⁻¹/ }));
    expect(screen.getByLabelText('ready').textContent).toBe('true');
    await userEvent.click(screen.getByRole('checkbox', { name: /reads as 8 M/ }));
    expect(screen.getByLabelText('ready').textContent).toBe('false');
  });

  it('when the file names no concentration unit, then the columns and units are open at the unit choice', () => {
    const open = { ...reading, mapping: { ...mapping, concentrationUnit: null }, points: [], questions: [] };
    render(<Preview start={open} />);
    const unit = screen.getByLabelText<HTMLSelectElement>('Concentration unit');
    expect(unit.closest('details')!.open).toBe(true);
    expect(unit.value).toBe('');
  });

  it('when nothing is doubtful, then no tick box is asked for and the columns stay folded', () => {
    render(<Preview start={{ ...reading, questions: [] }} />);
    expect(screen.queryByRole('group', { name: 'Check before using these points' })).toBeNull();
    expect(screen.getByLabelText('ready').textContent).toBe('true');
    expect(screen.getByLabelText('Concentration unit').closest('details')!.open).toBe(false);
  });
});
