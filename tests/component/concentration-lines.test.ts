import { describe, expect, it } from 'vitest';
import { chartColours } from '@/components/chart-theme';
import { linesByConcentration } from '@/features/mechanism/components/concentration-lines';

// The spectra of a titration, one line per [Q], as the absorption and emission-spectra plots draw them.
describe('linesByConcentration', () => {
  const rgb = (hex: string) => `rgb(${[1, 3, 5].map((start) => parseInt(hex.slice(start, start + 2), 16)).join(', ')})`;
  const spectra = [
    { concentration: 0, values: [1, 2] },
    { concentration: 0.002, values: [3, 4] },
    { concentration: 0.004, values: [5, 6] },
  ];

  it('when spectra are drawn, then each is a line on the wavelengths labelled with its [Q] in mM', () => {
    const lines = linesByConcentration([400, 410], spectra, (spectrum) => spectrum.values);
    // 0.002 M is 2 mM (SI prefixes, common practice)
    expect(lines.map((line) => line.label)).toEqual(['0 mM', '2 mM', '4 mM']);
    expect(lines[1]!.data).toEqual([
      { x: 400, y: 3 },
      { x: 410, y: 4 },
    ]);
    expect(lines[1]).toMatchObject({ showLine: true, pointRadius: 0, borderWidth: 1.5 });
  });

  it('when [Q] rises, then the colour runs from the points colour (none) to the line colour (the most)', () => {
    const lines = linesByConcentration([400, 410], spectra, (spectrum) => spectrum.values);
    expect(lines[0]!.borderColor).toBe(rgb(chartColours.points));
    expect(lines[2]!.borderColor).toBe(rgb(chartColours.line));
    expect(lines[1]!.backgroundColor).toBe(lines[1]!.borderColor);
    expect(lines[1]!.borderColor).not.toBe(lines[0]!.borderColor);
  });
});
