import { analyseSpectrumMatrix, EngineError, type SpectrumMatrixAnalysis } from '@shared/engine';
import type { SpectrumMatrixOptions, SpectrumMatrixReading, SpectrumPlot } from '@shared/schemas/spectrum-matrices';
import { concentrationInHeader } from '../studies/parse/header-units';
import { parseCellNumber } from '../studies/parse/parse-number';
import { cellProblem, ParseProblem } from '../studies/parse/parse-problem';
import type { Problem } from '../studies/parse/read-and-map';
import { readUpload } from '../studies/parse/read-upload';
import { UploadLimitExceeded, type UploadLimits } from '../studies/parse/upload-limits';

/** What a reading thread is asked for a spectrum matrix. */
export interface SpectrumMatrixTask {
  fileName: string;
  bytes: Uint8Array;
  options: SpectrumMatrixOptions;
  limits: UploadLimits;
}

export type SpectrumMatrixOutcome =
  | { kind: 'read'; reading: SpectrumMatrixReading; analysis: SpectrumMatrixAnalysis; plot: SpectrumPlot }
  | { kind: 'unreadable'; problems: Problem[] }
  | { kind: 'limit'; limit: keyof UploadLimits; message: string };

/** The plot keeps every k-th wavelength so that at most this many remain (the analysis uses all). */
export const PLOT_POINTS = 400;

export const asBuffer = (bytes: Uint8Array) => Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);

export interface Matrix {
  format: string;
  wavelengthHeader: string;
  wavelengths: number[];
  samples: { header: string; concentration: number; values: number[] }[];
}

/**
 * A spectrum matrix as numbers: wavelength (nm) in the first column, one spectrum per column
 * with its quencher concentration in the header ("0 mM", "[Q] = 2 uM"), every spectrum read at
 * every wavelength (one grid); descending wavelengths are turned round.
 */
export async function readMatrix(fileName: string, bytes: Buffer, limits: UploadLimits): Promise<Matrix> {
  const table = await readUpload(fileName, bytes, limits);
  const [wavelengthHeader, ...sampleHeaders] = table.headers;
  if (!wavelengthHeader || sampleHeaders.length < 3)
    throw new ParseProblem(
      `A spectrum matrix needs the wavelength in the first column and at least 3 spectra beside it; this file has ${sampleHeaders.length}.`,
    );
  const samples = sampleHeaders.map((header) => {
    const concentration = concentrationInHeader(header);
    if (concentration === null)
      throw new ParseProblem(
        `Spectrum "${header}" names no quencher concentration; write it in the column header, e.g. "0.5 mM".`,
        null,
        header,
      );
    return { header, concentration, values: [] as number[] };
  });
  const wavelengths = table.rows.map((row) => {
    const cell = row.cells[0] ?? '';
    const value = parseCellNumber(cell, table.decimalComma);
    if (value === undefined || value === null)
      throw cellProblem(row.line, wavelengthHeader, 'a wavelength in nm', cell);
    samples.forEach((sample, i) => {
      const text = row.cells[i + 1] ?? '';
      const reading = parseCellNumber(text, table.decimalComma);
      if (reading === null)
        throw new ParseProblem(
          `Spectrum "${sample.header}" has no reading at ${value} nm (row ${row.line}): the spectra are on different wavelength grids. Put every spectrum on one grid before uploading.`,
          row.line,
          sample.header,
        );
      if (reading === undefined) throw cellProblem(row.line, sample.header, 'a number', text);
      sample.values.push(reading);
    });
    return value;
  });
  if (wavelengths.length >= 2 && wavelengths[0]! > wavelengths[1]!) {
    wavelengths.reverse();
    for (const sample of samples) sample.values.reverse();
  }
  // 1 <= i < length: i and i - 1 index readings.
  for (let i = 1; i < wavelengths.length; i++)
    if (!(wavelengths[i]! > wavelengths[i - 1]!))
      throw new ParseProblem(
        `The wavelengths must rise (or fall) steadily: ${wavelengths[i]} nm follows ${wavelengths[i - 1]} nm.`,
        null,
        wavelengthHeader,
      );
  return { format: table.format, wavelengthHeader, wavelengths, samples };
}

/** What a read matrix holds, as kept with its record: the grid and each sample's header and [Q]. */
export const readingOf = (matrix: Matrix): SpectrumMatrixReading => ({
  format: matrix.format,
  wavelengthHeader: matrix.wavelengthHeader,
  firstWavelength: matrix.wavelengths[0]!,
  lastWavelength: matrix.wavelengths.at(-1)!,
  wavelengthCount: matrix.wavelengths.length,
  samples: matrix.samples.map(({ header, concentration }) => ({ header, concentration })),
});

function plotOf(matrix: Matrix): SpectrumPlot {
  const step = Math.max(1, Math.ceil(matrix.wavelengths.length / PLOT_POINTS));
  const keep = <T>(values: readonly T[]) => values.filter((_, i) => i % step === 0);
  return {
    wavelengths: keep(matrix.wavelengths),
    spectra: matrix.samples.map((sample) => ({ concentration: sample.concentration, values: keep(sample.values) })),
  };
}

/**
 * Reads a spectrum matrix and analyses it (analyseSpectrumMatrix) in a reading thread
 * (upload-reader.ts runs it by name), under the upload limits; a file or an analysis that
 * cannot be done comes back as problems naming the row, column or concentration.
 */
export async function readSpectrumMatrix(task: SpectrumMatrixTask): Promise<SpectrumMatrixOutcome> {
  try {
    const matrix = await readMatrix(task.fileName, asBuffer(task.bytes), task.limits);
    const analysis = analyseSpectrumMatrix({
      wavelengths: matrix.wavelengths,
      concentrations: matrix.samples.map((sample) => sample.concentration),
      spectra: matrix.samples.map((sample) => sample.values),
      bandWidth: task.options.bandWidth,
    });
    return {
      kind: 'read',
      reading: readingOf(matrix),
      analysis,
      plot: plotOf(matrix),
    };
  } catch (error) {
    if (error instanceof ParseProblem)
      return { kind: 'unreadable', problems: [{ row: error.row, column: error.column, message: error.message }] };
    if (error instanceof EngineError)
      return { kind: 'unreadable', problems: [{ row: null, column: null, message: error.message }] };
    if (error instanceof UploadLimitExceeded) return { kind: 'limit', limit: error.limit, message: error.message };
    throw error;
  }
}
