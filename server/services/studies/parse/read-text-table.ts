import { parse } from 'csv-parse/sync';
import { looksLikeDecimalComma, parseCellNumber } from './parse-number';
import { ParseProblem } from './parse-problem';
import { checkLines } from './scan-lines';
import { DEFAULT_UPLOAD_LIMITS, limitMessage, UploadLimitExceeded, type UploadLimits } from './upload-limits';

export interface RawTable {
  headers: string[];
  /** data rows as cell texts, with the file's line number of each */
  rows: Array<{ line: number; cells: string[] }>;
  decimalComma: boolean;
  format: string;
  /** the reader knows the layout (JCAMP-DX spectra), so the mapping need not guess from headers */
  layoutHint?: 'spectrum';
  /** spectra on different wavelength grids: a blank intensity cell means "not measured there" */
  blankIsUnmeasured?: boolean;
}

type Delimiter = '\t' | ';' | ',' | 'whitespace';
/** In this order when two delimiters explain the lines equally well. */
const DELIMITERS: Delimiter[] = ['\t', ';', ',', 'whitespace'];
const DELIMITER_NAMES: Record<Delimiter, string> = {
  ',': 'comma',
  ';': 'semicolon',
  '\t': 'tab',
  whitespace: 'whitespace',
};
/** Lines looked at to choose the delimiter; ragged rows further down are still named after parsing. */
const SAMPLE_LINES = 1000;
const MAX_NAMED_ROWS = 10;

/** Bytes to text: UTF-8 (BOM dropped), refusing binary data rather than guessing. */
export function decodeText(bytes: Buffer): string {
  if (bytes.length === 0) throw new ParseProblem('The file is empty.');
  if (bytes.includes(0))
    throw new ParseProblem(
      'The file holds binary data, not text; export the data as CSV or text, or upload the .xlsx workbook.',
    );
  try {
    return new TextDecoder('utf-8', { fatal: true, ignoreBOM: false }).decode(bytes);
  } catch {
    throw new ParseProblem('The file is not UTF-8 text; export it from the instrument program as UTF-8 CSV or text.');
  }
}

const splitWhitespace = (line: string) => line.trim().split(/\s+/);

/** Cells a line splits into (quotes ignored, so a quoted delimiter counts: an upper bound). */
function fieldCount(line: string, delimiter: Delimiter): number {
  if (delimiter === 'whitespace') return splitWhitespace(line).length;
  let count = 1;
  for (let i = line.indexOf(delimiter); i !== -1; i = line.indexOf(delimiter, i + 1)) count += 1;
  return count;
}

/** The most frequent count and the share of lines that have it. */
function agreement(counts: number[]) {
  const frequency = new Map<number, number>();
  for (const count of counts) frequency.set(count, (frequency.get(count) ?? 0) + 1);
  let modal = 0;
  let lines = 0;
  for (const [count, times] of frequency)
    if (times > lines || (times === lines && count > modal)) [modal, lines] = [count, times];
  return { modal, share: lines / counts.length };
}

/**
 * The delimiter on which most lines agree about the number of cells (at least two), so one
 * short or long row cannot turn a comma file into "one column, whitespace-separated": that
 * row is named after parsing instead. Decimal commas separated by spaces ("0,5 12,3") read as
 * whitespace-separated.
 */
function detectDelimiter(lines: string[]): Delimiter {
  const sample = lines.slice(0, SAMPLE_LINES);
  const scored = DELIMITERS.map((delimiter) => ({
    delimiter,
    ...agreement(sample.map((line) => fieldCount(line, delimiter))),
  })).filter((candidate) => candidate.modal >= 2);
  if (scored.length === 0) return 'whitespace';
  const best = scored.reduce((winner, candidate) => (candidate.share > winner.share ? candidate : winner));
  if (best.delimiter === ',') {
    const spaced = scored.find((candidate) => candidate.delimiter === 'whitespace');
    const dataLines = sample.slice(1);
    if (
      spaced &&
      spaced.share >= best.share &&
      dataLines.length > 0 &&
      dataLines.every((line) => splitWhitespace(line).every(looksLikeDecimalComma))
    )
      return 'whitespace';
  }
  return best.delimiter;
}

function isNumberRow(cells: string[], decimalComma: boolean) {
  return (
    cells.length > 0 && cells.every((cell) => cell.trim() === '' || parseCellNumber(cell, decimalComma) !== undefined)
  );
}

/** Refuses too many columns or cells before csv-parse makes a string of every cell. */
function checkWidth(lines: Array<{ line: number; text: string }>, delimiter: Delimiter, limits: UploadLimits) {
  let cells = 0;
  for (const { line, text } of lines) {
    const width = fieldCount(text, delimiter);
    if (width > limits.columns) throw new UploadLimitExceeded('columns', limitMessage.columns(limits, line, width));
    cells += width;
    if (cells > limits.cells) throw new UploadLimitExceeded('cells', limitMessage.cells(limits));
  }
}

/** Names every row whose cell count differs from the header's (the first few by line). */
function checkRagged(rows: RawTable['rows'], columns: number, delimiter: Delimiter) {
  const ragged = rows.filter((row) => row.cells.length !== columns);
  if (ragged.length === 0) return;
  const first = ragged[0]!;
  const others = ragged.slice(1, MAX_NAMED_ROWS).map((row) => row.line);
  const more = ragged.length > MAX_NAMED_ROWS ? ` and ${ragged.length - MAX_NAMED_ROWS} more` : '';
  throw new ParseProblem(
    `Row ${first.line} has ${first.cells.length} cell${first.cells.length === 1 ? '' : 's'} where the header has ${columns} columns.` +
      (others.length === 1 && more === '' ? ` Row ${others[0]} differs too.` : '') +
      (others.length > 1 || more !== '' ? ` Rows ${others.join(', ')}${more} differ too.` : '') +
      ` The file was read as ${DELIMITER_NAMES[delimiter]}-separated, as most of its lines are.`,
    first.line,
  );
}

/**
 * Reads delimited text (comma, semicolon, tab or whitespace; UTF-8 with or without BOM;
 * lines starting with # are comments) into a header row and data rows. Cells stay text; the
 * mapping converts them, so a bad cell can be named by row and column. Lines, rows, columns
 * and cells are counted against the limits before the cells are made.
 */
export function readTextTable(bytes: Buffer, limits: UploadLimits = DEFAULT_UPLOAD_LIMITS): RawTable {
  checkLines(bytes, limits);
  const text = decodeText(bytes).replace(/^\uFEFF/, '');
  const lines: Array<{ line: number; text: string }> = [];
  text.split(/\r?\n/).forEach((line, index) => {
    if (line.trim() !== '' && !line.trimStart().startsWith('#')) lines.push({ line: index + 1, text: line });
  });
  if (lines.length === 0) throw new ParseProblem('The file holds no table: no lines with values.');
  const delimiter = detectDelimiter(lines.map((line) => line.text));
  checkWidth(lines, delimiter, limits);
  let records: Array<{ line: number; cells: string[] }>;
  if (delimiter === 'whitespace') {
    records = lines.map(({ line, text: content }) => ({ line, cells: splitWhitespace(content) }));
  } else {
    try {
      const parsed = parse(text, {
        delimiter,
        relax_column_count: true,
        skip_empty_lines: true,
        comment: '#',
        info: true,
        trim: true,
        relax_quotes: true,
        max_record_size: limits.lineBytes,
      }) as unknown as Array<{ record: string[]; info: { lines: number } }>;
      records = parsed.map((entry) => ({ line: entry.info.lines, cells: entry.record }));
    } catch (error) {
      throw new ParseProblem(`The text could not be split into columns: ${(error as Error).message}`);
    }
  }
  // A comma-separated file cannot use decimal commas; only the others are searched (cell by cell, no copy).
  const decimalComma = delimiter !== ',' && records.slice(1).some((record) => record.cells.some(looksLikeDecimalComma));
  const hasHeader = !isNumberRow(records[0]!.cells, decimalComma);
  const headers = hasHeader
    ? records[0]!.cells.map((cell) => cell.trim())
    : records[0]!.cells.map((_, i) => `column ${i + 1}`);
  const rows = hasHeader ? records.slice(1) : records;
  if (rows.length === 0) throw new ParseProblem('The file has a header row but no data rows.', records[0]!.line);
  if (headers.length < 2 || rows.every((row) => row.cells.length === 1))
    throw new ParseProblem(
      `Only one column was found (read as ${DELIMITER_NAMES[delimiter]}-separated); a series needs at least concentration and intensity.`,
    );
  checkRagged(rows, headers.length, delimiter);
  return {
    headers,
    rows,
    decimalComma,
    format: `${DELIMITER_NAMES[delimiter]}-separated text${decimalComma ? ' with decimal commas' : ''}`,
  };
}
