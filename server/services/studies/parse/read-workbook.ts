import { Readable } from 'node:stream';
import ExcelJS from 'exceljs';
import { checkWorkbookParts } from './check-workbook';
import { ParseProblem } from './parse-problem';
import type { RawTable } from './read-text-table';
import { DEFAULT_UPLOAD_LIMITS, limitMessage, UploadLimitExceeded, type UploadLimits } from './upload-limits';

const cellText = (value: ExcelJS.CellValue): string => {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return String(value);
  if (typeof value === 'string') return value;
  if (typeof value === 'object' && 'result' in value) return cellText(value.result as ExcelJS.CellValue);
  if (typeof value === 'object' && 'richText' in value) return value.richText.map((part) => part.text).join('');
  return String(value);
};

/**
 * The first worksheet of an .xlsx workbook as a header row and data rows. The package is
 * unpacked once under the size limits (check-workbook.ts), then read row by row with exceljs's
 * streaming reader, counting rows, columns, cells and cell text as they come, so a sheet never
 * has to fit in memory as a whole workbook model.
 */
export async function readWorkbook(bytes: Buffer, limits: UploadLimits = DEFAULT_UPLOAD_LIMITS): Promise<RawTable> {
  await checkWorkbookParts(bytes, limits);
  const reader = new ExcelJS.stream.xlsx.WorkbookReader(Readable.from([bytes]), {
    worksheets: 'emit',
    sharedStrings: 'cache',
    styles: 'ignore',
    hyperlinks: 'ignore',
    entries: 'ignore',
  });
  const records: Array<{ line: number; cells: string[] }> = [];
  let name: string | null = null;
  let width = 0;
  let cells = 0;
  let characters = 0;
  try {
    for await (const worksheet of reader) {
      // Later sheets are read through (the reader cleans up after each) but not kept.
      if (name !== null) {
        for await (const row of worksheet) void row;
        continue;
      }
      name = (worksheet as unknown as { name?: string }).name ?? 'sheet 1';
      for await (const row of worksheet) {
        const values = row.values as ExcelJS.CellValue[];
        const columns = Math.max(0, values.length - 1);
        if (columns > limits.columns)
          throw new UploadLimitExceeded('columns', limitMessage.columns(limits, row.number, columns));
        const texts = Array.from({ length: columns }, (_, i) => cellText(values[i + 1]).trim());
        if (!texts.some((text) => text !== '')) continue;
        if (records.length >= limits.rows + 1) throw new UploadLimitExceeded('rows', limitMessage.rows(limits));
        cells += columns;
        if (cells > limits.cells) throw new UploadLimitExceeded('cells', limitMessage.cells(limits));
        for (const text of texts) characters += text.length;
        if (characters > limits.cellTextCharacters)
          throw new UploadLimitExceeded('cellTextCharacters', limitMessage.cellTextCharacters(limits));
        width = Math.max(width, columns);
        records.push({ line: row.number, cells: texts });
      }
    }
  } catch (error) {
    if (error instanceof UploadLimitExceeded || error instanceof ParseProblem) throw error;
    throw new ParseProblem('The file is not a readable .xlsx workbook.');
  }
  if (name === null || records.length === 0) throw new ParseProblem("The workbook's first sheet is empty.");
  if (records.length < 2) throw new ParseProblem('The first sheet has a header row but no data rows.');
  for (const record of records) while (record.cells.length < width) record.cells.push('');
  return {
    headers: records[0]!.cells,
    rows: records.slice(1),
    decimalComma: false,
    format: `workbook sheet "${name}"`,
  };
}
