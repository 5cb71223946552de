import path from 'node:path';
import type { DecayColumn, DecayTimeUnit } from '@shared/schemas/decays';
import { TIME_UNITS } from '@shared/units/units';
import { readJcampBlocks } from '../studies/parse/check-jcamp';
import { concentrationInHeader, timeUnitOf } from '../studies/parse/header-units';
import { parseCellNumber } from '../studies/parse/parse-number';
import { cellProblem, ParseProblem } from '../studies/parse/parse-problem';
import { JCAMP_EXTENSIONS, readUpload } from '../studies/parse/read-upload';
import { limitMessage, UploadLimitExceeded, type UploadLimits } from '../studies/parse/upload-limits';

/** One counts column of a decay file, with the role and concentration proposed from its header. */
export interface DecayTableColumn {
  column: number;
  header: string;
  counts: number[];
  role: DecayColumn['role'];
  /** mol/L, from the header ("0.5 mM", "[Q] = 2 uM"); null when it names none */
  concentration: number | null;
}

/** A decay file as numbers: the time axis in its own unit and the counts columns. */
export interface DecayTable {
  format: string;
  timeHeader: string;
  /** the unit the time header names; null when it names none */
  timeUnit: DecayTimeUnit | null;
  /** times as written (in timeUnit) */
  time: number[];
  columns: DecayTableColumn[];
}

/** Headers that name the instrument response rather than a decay (common practice in instrument exports). */
const RESPONSE_HEADER = /\b(irf|response|prompt|instrument|scatter|lamp|ludox)\b/i;
/** Evenly spaced channels may differ by rounding in the file; more than this is a real gap (1 %). */
const SPACING_TOLERANCE = 0.01;

const roleOf = (header: string): DecayColumn['role'] => (RESPONSE_HEADER.test(header) ? 'response' : 'decay');

/** "##XUNITS=NANOSECONDS" and friends (JCAMP-DX 4.24 writes units out) -> a time unit. */
const JCAMP_TIME_UNITS: Record<string, DecayTimeUnit> = {
  SECONDS: 's',
  S: 's',
  MILLISECONDS: 'ms',
  MS: 'ms',
  MICROSECONDS: 'us',
  US: 'us',
  NANOSECONDS: 'ns',
  NS: 'ns',
  PICOSECONDS: 'ps',
  PS: 'ps',
};

/**
 * JCAMP-DX blocks whose x axis is time (##XUNITS= SECONDS, NANOSECONDS ...): one decay per
 * block, all on the first block's channels. The block title carries the concentration, as in
 * a text header.
 */
function readJcampDecays(bytes: Buffer, limits: UploadLimits): DecayTable {
  const entries = readJcampBlocks(bytes, limits);
  if (entries.length === 0) throw new ParseProblem('The JCAMP-DX file holds no data block (no ##XYDATA=).');
  let unit: DecayTimeUnit | null = null;
  let time: number[] = [];
  const columns: DecayTableColumn[] = entries.map((entry, index) => {
    const spectrum = entry.spectra[0]!;
    const title = entry.title?.trim() || `decay ${index + 1}`;
    const units = String(spectrum.xUnits ?? entry.info.XUNITS ?? '')
      .trim()
      .toUpperCase();
    const blockUnit = JCAMP_TIME_UNITS[units];
    if (!blockUnit)
      throw new ParseProblem(
        `Block "${title}" has ##XUNITS=${units || ' (none)'}; a decay needs a time axis (SECONDS, NANOSECONDS, PICOSECONDS, MICROSECONDS).`,
      );
    const { x = [], y = [] } = spectrum.data;
    if (index === 0) {
      unit = blockUnit;
      time = [...x];
    } else if (blockUnit !== unit || x.length !== time.length)
      throw new ParseProblem(`Block "${title}" is on other channels than the first block; send one file per decay.`);
    return {
      column: index + 1,
      header: title,
      counts: [...y],
      role: roleOf(title),
      concentration: concentrationInHeader(title),
    };
  });
  if (columns.length > limits.columns)
    throw new UploadLimitExceeded('columns', limitMessage.columns(limits, 1, columns.length + 1));
  return {
    format: `JCAMP-DX, ${columns.length} block${columns.length === 1 ? '' : 's'}`,
    timeHeader: `time (${unit})`,
    timeUnit: unit,
    time,
    columns,
  };
}

/** Text or workbook: the first column is time, every other column counts. */
async function readTableDecays(fileName: string, bytes: Buffer, limits: UploadLimits): Promise<DecayTable> {
  const table = await readUpload(fileName, bytes, limits);
  const numbers = (columnIndex: number) =>
    table.rows.map((row) => {
      const cell = row.cells[columnIndex] ?? '';
      const value = parseCellNumber(cell, table.decimalComma);
      if (value === undefined || value === null)
        throw cellProblem(row.line, table.headers[columnIndex] ?? `${columnIndex + 1}`, 'a number', cell);
      return value;
    });
  const timeHeader = table.headers[0]!;
  const unit = timeUnitOf(timeHeader);
  return {
    format: table.format,
    timeHeader,
    timeUnit: unit && unit in TIME_UNITS ? (unit as DecayTimeUnit) : null,
    time: numbers(0),
    columns: table.headers.slice(1).map((header, i) => ({
      column: i + 1,
      header,
      counts: numbers(i + 1),
      role: roleOf(header),
      concentration: concentrationInHeader(header),
    })),
  };
}

/** Time must increase by the same step (one channel width) on every row. */
function checkTimeAxis(table: DecayTable) {
  const { time } = table;
  if (time.length < 2) throw new ParseProblem('The decay has fewer than two channels.');
  const step = (time.at(-1)! - time[0]!) / (time.length - 1);
  for (let i = 1; i < time.length; i++) {
    const difference = time[i]! - time[i - 1]!;
    if (!(difference > 0))
      throw new ParseProblem(
        `Time does not increase at channel ${i + 1} (${time[i - 1]} then ${time[i]}); a decay histogram has one row per channel in time order.`,
        null,
        table.timeHeader,
      );
    if (Math.abs(difference - step) > SPACING_TOLERANCE * step)
      throw new ParseProblem(
        `Channels are not evenly spaced: channel ${i + 1} is ${difference} after the one before, the mean step is ${step.toPrecision(4)}.`,
        null,
        table.timeHeader,
      );
  }
  for (const column of table.columns) {
    const negative = column.counts.findIndex((count) => count < 0);
    if (negative !== -1)
      throw new ParseProblem(
        `Column "${column.header}", channel ${negative + 1}: counts cannot be negative (${column.counts[negative]}); upload the raw histogram, not background-subtracted data.`,
        null,
        column.header,
      );
  }
}

/**
 * Reads a decay file (TCSPC or multichannel-scaling histograms): delimited text or .xlsx with
 * time in the first column (its unit in the header: ps, ns, us, ms or s) and one counts column
 * per decay, the concentration of each in its header, a response (IRF) column named so; or
 * JCAMP-DX blocks on a time axis. Parsing reuses the upload readers and their limits; throws
 * ParseProblem naming the row or column, or UploadLimitExceeded.
 */
export async function readDecayTable(fileName: string, bytes: Buffer, limits: UploadLimits): Promise<DecayTable> {
  if (bytes.length === 0) throw new ParseProblem('The file is empty.');
  const table = JCAMP_EXTENSIONS.includes(path.extname(fileName).toLowerCase())
    ? readJcampDecays(bytes, limits)
    : await readTableDecays(fileName, bytes, limits);
  if (table.columns.length === 0) throw new ParseProblem('The file holds a time column but no counts column.');
  checkTimeAxis(table);
  return table;
}
