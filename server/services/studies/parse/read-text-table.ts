import { parse } from 'csv-parse/sync';
import { looksLikeDecimalComma, parseCellNumber } from './parse-number';
import { ParseProblem } from './parse-problem';

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

type Delimiter = ',' | ';' | '\t' | 'whitespace';
const DELIMITER_NAMES: Record<Delimiter, string> = {
  ',': 'comma',
  ';': 'semicolon',
  '\t': 'tab',
  whitespace: 'whitespace',
};

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

/** The delimiter most lines agree on: tab, then semicolon, then comma, else runs of spaces. */
function detectDelimiter(lines: string[]): Delimiter {
  const sample = lines.slice(0, 20);
  // Every line must hold the character; equal counts are checked later, so a short row is named.
  const consistent = (char: string) => sample.every((line) => line.includes(char));
  if (consistent('\t')) return '\t';
  if (consistent(';')) return ';';
  if (consistent(',')) {
    // "0,5 12,3" is decimal commas separated by spaces, not a comma-separated file.
    const spaced = sample.every((line) => line.trim().split(/\s+/).length > 1);
    if (!spaced || !sample.slice(1).every((line) => line.trim().split(/\s+/).every(looksLikeDecimalComma))) return ',';
  }
  return 'whitespace';
}

function isNumberRow(cells: string[], decimalComma: boolean) {
  return (
    cells.length > 0 && cells.every((cell) => cell.trim() === '' || parseCellNumber(cell, decimalComma) !== undefined)
  );
}

/**
 * Reads delimited text (comma, semicolon, tab or whitespace; UTF-8 with or without BOM;
 * lines starting with # are comments) into a header row and data rows. Cells stay text; the
 * mapping converts them, so a bad cell can be named by row and column.
 */
export function readTextTable(bytes: Buffer): RawTable {
  const text = decodeText(bytes).replace(/^\uFEFF/, '');
  const lines = text.split(/\r?\n/).filter((line) => line.trim() !== '' && !line.trimStart().startsWith('#'));
  if (lines.length === 0) throw new ParseProblem('The file holds no table: no lines with values.');
  const delimiter = detectDelimiter(lines);
  let records: Array<{ line: number; cells: string[] }>;
  if (delimiter === 'whitespace') {
    records = [];
    text.split(/\r?\n/).forEach((line, index) => {
      if (line.trim() !== '' && !line.trimStart().startsWith('#'))
        records.push({ line: index + 1, cells: line.trim().split(/\s+/) });
    });
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
  for (const row of rows) {
    if (row.cells.length !== headers.length) {
      throw new ParseProblem(
        `Row ${row.line} has ${row.cells.length} cells where the header has ${headers.length} columns.`,
        row.line,
      );
    }
  }
  return {
    headers,
    rows,
    decimalComma,
    format: `${DELIMITER_NAMES[delimiter]}-separated text${decimalComma ? ' with decimal commas' : ''}`,
  };
}
