/**
 * How much work one uploaded file may make, checked while it is read (not after): a 20 MB
 * upload can still expand to gigabytes (compressed workbooks, JCAMP-DX run-length lines, one
 * endless line). The defaults leave room for real instrument exports: a 20 MB spectrum matrix
 * of 200 spectra at 11,000 wavelengths holds 2.3 million cells.
 */
export interface UploadLimits {
  /** longest line of a text or JCAMP-DX file, in bytes */
  lineBytes: number;
  /** data rows of a table (wavelengths of a spectrum matrix) */
  rows: number;
  /** columns of a table (spectra of a matrix) */
  columns: number;
  /** cells of a table, rows x columns */
  cells: number;
  /** points of one JCAMP-DX spectrum, declared (##NPOINTS=) or after run-length (DUP) expansion */
  spectrumPoints: number;
  /** points a mapping may give one series */
  seriesPoints: number;
  /** all parts of an .xlsx workbook after decompression, bytes */
  inflatedBytes: number;
  /** the shared-strings part of an .xlsx after decompression, bytes */
  sharedStringBytes: number;
  /** one worksheet part of an .xlsx after decompression, bytes */
  sheetBytes: number;
  /** text of all cells of a workbook sheet once shared strings are written out, characters */
  cellTextCharacters: number;
  /** time to read one file and apply a mapping, seconds */
  seconds: number;
  /** heap of the reading thread, MB; a file that needs more is refused */
  memoryMb: number;
}

export const DEFAULT_UPLOAD_LIMITS: UploadLimits = {
  lineBytes: 256 * 1024,
  rows: 100_000,
  columns: 2_000,
  cells: 3_000_000,
  spectrumPoints: 100_000,
  seriesPoints: 10_000,
  inflatedBytes: 64 * 1024 * 1024,
  sharedStringBytes: 16 * 1024 * 1024,
  sheetBytes: 48 * 1024 * 1024,
  cellTextCharacters: 32 * 1024 * 1024,
  seconds: 30,
  memoryMb: 384,
};

const count = (value: number) => value.toLocaleString('en-US');
const megabytes = (bytes: number) => `${Math.round((bytes / 1024 / 1024) * 10) / 10} MB`;

/** The file asks for more than a limit allows; the message names the limit and the file's figure. */
export class UploadLimitExceeded extends Error {
  constructor(
    readonly limit: keyof UploadLimits,
    message: string,
  ) {
    super(message);
    this.name = 'UploadLimitExceeded';
  }
}

/** Messages naming each limit in the user's terms. */
export const limitMessage = {
  lineBytes: (limits: UploadLimits, line: number) =>
    `Line ${count(line)} is longer than ${megabytes(limits.lineBytes)}, the longest line Halflight reads; a table has one row per line.`,
  rows: (limits: UploadLimits) =>
    `The file has more than ${count(limits.rows)} rows, the most Halflight reads from one upload; a titration or a spectrum matrix fits far below that.`,
  columns: (limits: UploadLimits, row: number, columns: number) =>
    `Row ${count(row)} has ${count(columns)} columns; Halflight reads at most ${count(limits.columns)} columns.`,
  cells: (limits: UploadLimits) =>
    `The table has more than ${count(limits.cells)} cells (rows x columns), the most Halflight reads from one upload.`,
  spectrumPoints: (limits: UploadLimits, what: string, points: number) =>
    `${what} ${count(points)} points; Halflight reads at most ${count(limits.spectrumPoints)} points per spectrum.`,
  seriesPoints: (limits: UploadLimits, points: number) =>
    `This mapping gives ${count(points)} points; a series holds at most ${count(limits.seriesPoints)} points.`,
  inflatedBytes: (limits: UploadLimits) =>
    `The workbook unpacks to more than ${megabytes(limits.inflatedBytes)}, the most Halflight unpacks from one upload.`,
  sharedStringBytes: (limits: UploadLimits) =>
    `The workbook's shared strings unpack to more than ${megabytes(limits.sharedStringBytes)}, the most Halflight reads.`,
  sheetBytes: (limits: UploadLimits, part: string) =>
    `The worksheet ${part} unpacks to more than ${megabytes(limits.sheetBytes)}, the most Halflight reads for one sheet.`,
  cellTextCharacters: (limits: UploadLimits) =>
    `The sheet's cell text comes to more than ${count(limits.cellTextCharacters)} characters once shared strings are written out, the most Halflight reads.`,
  seconds: (limits: UploadLimits) =>
    `Reading the file took longer than ${limits.seconds} seconds, the time Halflight gives one upload; the file is kept, and sending it again reads it again.`,
  memoryMb: (limits: UploadLimits) =>
    `Reading the file needed more than ${limits.memoryMb} MB of memory, the most Halflight gives one upload.`,
};
