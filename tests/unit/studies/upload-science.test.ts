import { describe, expect, it } from 'vitest';
import type { UploadMapping } from '../../../shared/schemas/study-uploads';
import { readAndMap, type ReadOutcome } from '../../../server/services/studies/parse/read-and-map';
import type { StudyReading } from '../../../server/services/studies/parse/propose-mapping';
import { DEFAULT_UPLOAD_LIMITS } from '../../../server/services/studies/parse/upload-limits';

/**
 * An invented spectrum matrix on a 1 nm grid (400–800 nm): a triangular band (peak 100 at
 * 600 nm, zero beyond 500 and 700 nm) scaled by 1 / (1 + 500 [Q]), on a flat offset of 40
 * counts. The trapezoid rule is exact for it (every kink lies on a grid point), so the
 * expected integrals are hand-computed areas of triangles and rectangles.
 */
const OFFSET = 40;
const K_SV = 500; // M^-1, invented
const concentrationsMm = [0, 1, 2, 3, 4];
const band = (nm: number) => Math.max(0, 100 - Math.abs(nm - 600));
function spectrumCsv() {
  const lines = [['wavelength (nm)', ...concentrationsMm.map((c) => `${c} mM`)].join(',')];
  for (let nm = 400; nm <= 800; nm++)
    lines.push([nm, ...concentrationsMm.map((c) => band(nm) / (1 + K_SV * c * 1e-3) + OFFSET)].join(','));
  return Buffer.from(`${lines.join('\n')}\n`);
}
const noStudy: StudyReading = { windowStart: null, windowEnd: null, emissionWavelength: null };
const read = async (bytes: Buffer, mapping: UploadMapping | null, study: StudyReading = noStudy) => {
  const outcome: ReadOutcome = await readAndMap({
    fileName: 'x.csv',
    bytes,
    mapping,
    limits: DEFAULT_UPLOAD_LIMITS,
    study,
  });
  if (outcome.kind !== 'read') throw new Error(JSON.stringify(outcome));
  return outcome;
};

describe('spectrum reduction follows the study', () => {
  it('when the study has an emission window, then the proposed reduction integrates over it, not the whole spectrum', async () => {
    const outcome = await read(spectrumCsv(), null, { ...noStudy, windowStart: 560, windowEnd: 680 });
    expect(outcome.mapping).toMatchObject({ reduction: { kind: 'window', start: 560, end: 680 }, baseline: null });
    // Blank over 560–680 nm: band area 3200 (560–600) + 4800 (600–680) = 8000, plus 40 x 120 nm = 4800 (hand-computed)
    expect(outcome.points[0]!.intensity).toBeCloseTo(12_800, 9);
  });

  it('when the study gives only an emission wavelength, then the proposal reads the spectra there', async () => {
    const outcome = await read(spectrumCsv(), null, { ...noStudy, emissionWavelength: 610 });
    expect(outcome.mapping).toMatchObject({ reduction: { kind: 'wavelength', at: 610 } });
    expect(outcome.points[0]!.intensity).toBeCloseTo(130, 9); // band(610) = 90, plus the offset 40 (hand-computed)
  });

  it("when the study's window lies outside the spectra, then the shared range is proposed and a note says why", async () => {
    const outcome = await read(spectrumCsv(), null, { ...noStudy, windowStart: 300, windowEnd: 450 });
    expect(outcome.mapping).toMatchObject({ reduction: { kind: 'window', start: 400, end: 800 } });
    expect(outcome.warnings[0]).toMatch(/emission window 300–450 nm reaches outside the spectra \(400–800 nm\)/);
  });

  it('when a baseline region is given, then its mean is taken off every spectrum and I0/I falls on the line the spectra were built from', async () => {
    const proposed = await read(spectrumCsv(), null, { ...noStudy, windowStart: 560, windowEnd: 680 });
    const mapping = { ...proposed.mapping, baseline: { start: 750, end: 800 } } as UploadMapping;
    const outcome = await read(spectrumCsv(), mapping);
    // Without the offset each integral is 8000 / (1 + 500 [Q]) (hand-computed above), so I0/I = 1 + 500 [Q] exactly.
    const intensities = outcome.points.map((point) => point.intensity!);
    expect(intensities[0]).toBeCloseTo(8000, 9);
    concentrationsMm.forEach((c, i) => expect(intensities[0]! / intensities[i]!).toBeCloseTo(1 + K_SV * c * 1e-3, 12));
  });
});

describe('concentration units are chosen, never guessed', () => {
  // Invented series: I = 1000 / (1 + 0.25 [Q]) with [Q] = 0, 2, 4, 6, 8 in the file's (unstated) unit.
  const series = Buffer.from(
    `[Q],intensity\n${[0, 2, 4, 6, 8].map((q) => `${q},${1000 / (1 + 0.25 * q)}`).join('\n')}\n`,
  );

  it('when the concentration header names no unit, then the proposal leaves it open, gives no points and asks', async () => {
    const outcome = await read(series, null);
    expect(outcome.mapping).toMatchObject({ layout: 'series', concentrationUnit: null });
    expect(outcome.points).toEqual([]);
    expect(outcome.problems).toEqual([]);
    expect(outcome.warnings).toEqual([expect.stringMatching(/"\[Q\]" names no unit: choose M, mM, µM or nM/)]);
  });

  it('when M is chosen for values up to 8, then the preview questions both the 8 M and the K_SV of 0.25 M^-1', async () => {
    const open = await read(series, null);
    const outcome = await read(series, { ...open.mapping, concentrationUnit: 'M' } as UploadMapping);
    expect(outcome.points).toHaveLength(5);
    // I0/I - 1 = 0.25 [Q] exactly, so the least-squares slope is 0.25 M^-1 (by construction; in mM it would read 250)
    expect(outcome.questions).toEqual([
      { code: 'concentration_above_1_molar', message: expect.stringMatching(/highest concentration reads as 8 M/) },
      {
        code: 'ksv_below_1_per_molar',
        message: expect.stringMatching(/K_SV of about 0\.25 M⁻¹ .*read as mM, K_SV would be 250 M⁻¹/),
      },
    ]);
    // Questions are not plain notes: they are asked apart so that applying can require an answer.
    expect(outcome.warnings).toEqual([]);
  });

  it('when mM is chosen, then the same points raise no question', async () => {
    const open = await read(series, null);
    const outcome = await read(series, { ...open.mapping, concentrationUnit: 'mM' } as UploadMapping);
    expect(outcome.warnings).toEqual([]);
    expect(outcome.questions).toEqual([]);
  });
});
