import {
  absorptionDifferences,
  analyseAbsorptionTitration,
  EngineError,
  type AbsorptionTitrationAnalysis,
  type QuencherAbsorbance,
} from '@shared/engine';
import type { AbsorptionOptions, AbsorptionPlot } from '@shared/schemas/absorption-titrations';
import type { SpectrumMatrixReading } from '@shared/schemas/spectrum-matrices';
import type { StoredQuencherReading } from '../../models/absorption-titration.model';
import { concentrationInHeader } from '../studies/parse/header-units';
import { parseCellNumber } from '../studies/parse/parse-number';
import { cellProblem, ParseProblem } from '../studies/parse/parse-problem';
import type { Problem } from '../studies/parse/read-and-map';
import { readUpload } from '../studies/parse/read-upload';
import { UploadLimitExceeded, type UploadLimits } from '../studies/parse/upload-limits';
import { asBuffer, PLOT_POINTS, readingOf, readMatrix, type Matrix } from './read-spectrum-matrix';

/** What a reading thread is asked for an absorption titration. */
export interface AbsorptionTitrationTask {
  fileName: string;
  bytes: Uint8Array;
  quencher: { fileName: string; bytes: Uint8Array } | null;
  options: AbsorptionOptions;
  limits: UploadLimits;
}

export type AbsorptionTitrationOutcome =
  | {
      kind: 'read';
      reading: SpectrumMatrixReading & { quencher: StoredQuencherReading | null };
      analysis: AbsorptionTitrationAnalysis;
      plot: AbsorptionPlot;
    }
  | { kind: 'unreadable'; problems: Problem[] }
  | { kind: 'limit'; limit: keyof UploadLimits; message: string };

/** A quencher column headed like this holds ε in M^-1 cm^-1 rather than a spectrum at a stated [Q]. */
const ABSORPTIVITY_HEADER = /^\s*(ε|epsilon|absorptivity)/i;
/** Two grids are one when every wavelength agrees to this (nm): instrument files print a few decimals. */
const GRID_TOLERANCE_NM = 1e-3;

/**
 * The quencher's own absorbance: wavelength in the first column, one column beside it, on the
 * titration's wavelength grid (either order); a header naming a concentration ("quencher 10 mM")
 * makes it a spectrum at that [Q], a header starting "ε" or "epsilon" makes it ε in M^-1 cm^-1.
 */
async function readQuencher(
  file: { fileName: string; bytes: Uint8Array },
  matrix: Matrix,
  limits: UploadLimits,
): Promise<{ reading: StoredQuencherReading; absorbance: QuencherAbsorbance }> {
  const table = await readUpload(file.fileName, asBuffer(file.bytes), limits);
  const [wavelengthHeader, header, ...rest] = table.headers;
  if (!wavelengthHeader || !header || rest.length > 0)
    throw new ParseProblem(
      `The quencher's file needs the wavelength in the first column and exactly one column beside it; it has ${table.headers.length} columns.`,
    );
  const absorptivity = ABSORPTIVITY_HEADER.test(header);
  const concentration = absorptivity ? null : concentrationInHeader(header);
  if (!absorptivity && concentration === null)
    throw new ParseProblem(
      `The quencher's column "${header}" names neither its concentration ("quencher 10 mM") nor ε ("ε (M-1 cm-1)").`,
      null,
      header,
    );
  const points = table.rows.map((row) => {
    const cells = [row.cells[0] ?? '', row.cells[1] ?? ''];
    const [wavelength, value] = cells.map((cell) => parseCellNumber(cell, table.decimalComma));
    if (wavelength === undefined || wavelength === null)
      throw cellProblem(row.line, wavelengthHeader, 'a wavelength in nm', cells[0]!);
    if (value === undefined || value === null) throw cellProblem(row.line, header, 'a number', cells[1]!);
    return { wavelength, value };
  });
  if (points.length >= 2 && points[0]!.wavelength > points[1]!.wavelength) points.reverse();
  const offGrid =
    points.length === matrix.wavelengths.length
      ? points.findIndex((point, i) => Math.abs(point.wavelength - matrix.wavelengths[i]!) > GRID_TOLERANCE_NM)
      : -1;
  if (points.length !== matrix.wavelengths.length || offGrid >= 0)
    throw new ParseProblem(
      `The quencher's spectrum is on a different wavelength grid from the titration (${points.length} wavelengths from ${points[0]?.wavelength ?? '–'} nm against ${matrix.wavelengths.length} from ${matrix.wavelengths[0]} nm${offGrid >= 0 ? `; first difference at ${points[offGrid]!.wavelength} nm` : ''}). Put both on one grid before uploading.`,
      null,
      wavelengthHeader,
    );
  const values = points.map((point) => point.value);
  return {
    reading: { header, kind: absorptivity ? 'absorptivity' : 'spectrum', concentration },
    absorbance: absorptivity
      ? { kind: 'absorptivity', values }
      : { kind: 'spectrum', concentration: concentration!, values },
  };
}

/**
 * Reads an absorption titration (and the quencher's own file) and analyses it
 * (analyseAbsorptionTitration) in a reading thread under the upload limits; a file or an analysis
 * that cannot be done comes back as problems naming the row, column or field.
 */
export async function readAbsorptionTitration(task: AbsorptionTitrationTask): Promise<AbsorptionTitrationOutcome> {
  try {
    const matrix = await readMatrix(task.fileName, asBuffer(task.bytes), task.limits);
    const quencher = task.quencher ? await readQuencher(task.quencher, matrix, task.limits) : null;
    const input = {
      wavelengths: matrix.wavelengths,
      concentrations: matrix.samples.map((sample) => sample.concentration),
      spectra: matrix.samples.map((sample) => sample.values),
      pathLength: task.options.pathLength,
      bandWidth: task.options.bandWidth,
      ...(task.options.emitterConcentration !== undefined
        ? { emitterConcentration: task.options.emitterConcentration }
        : {}),
      ...(quencher ? { quencher: quencher.absorbance } : {}),
    };
    const analysis = analyseAbsorptionTitration(input);
    const { differences } = absorptionDifferences(input);
    const step = Math.max(1, Math.ceil(matrix.wavelengths.length / PLOT_POINTS));
    const keep = <T>(values: readonly T[]) => values.filter((_, i) => i % step === 0);
    return {
      kind: 'read',
      reading: { ...readingOf(matrix), quencher: quencher?.reading ?? null },
      analysis,
      plot: {
        wavelengths: keep(matrix.wavelengths),
        spectra: matrix.samples.map((sample, j) => ({
          concentration: sample.concentration,
          values: keep(sample.values),
          differences: keep(differences[j]!),
        })),
      },
    };
  } catch (error) {
    if (error instanceof ParseProblem)
      return { kind: 'unreadable', problems: [{ row: error.row, column: error.column, message: error.message }] };
    if (error instanceof EngineError)
      return { kind: 'unreadable', problems: [{ row: null, column: error.field, message: error.message }] };
    if (error instanceof UploadLimitExceeded) return { kind: 'limit', limit: error.limit, message: error.message };
    throw error;
  }
}
