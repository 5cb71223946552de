import ExcelJS from 'exceljs';
import { ParseProblem } from './parse-problem';
import type { RawTable } from './read-text-table';

const cellText = (value: ExcelJS.CellValue): string => {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return String(value);
  if (typeof value === 'string') return value;
  if (typeof value === 'object' && 'result' in value) return cellText(value.result as ExcelJS.CellValue);
  if (typeof value === 'object' && 'richText' in value) return value.richText.map((part) => part.text).join('');
  return String(value);
};

/** The first worksheet of an .xlsx workbook (read with exceljs) as a header row and data rows. */
export async function readWorkbook(bytes: Buffer): Promise<RawTable> {
  const workbook = new ExcelJS.Workbook();
  try {
    await workbook.xlsx.load(bytes as unknown as ArrayBuffer);
  } catch {
    throw new ParseProblem('The file is not a readable .xlsx workbook.');
  }
  const sheet = workbook.worksheets[0];
  if (!sheet || sheet.rowCount === 0) throw new ParseProblem("The workbook's first sheet is empty.");
  const records: Array<{ line: number; cells: string[] }> = [];
  const width = sheet.columnCount;
  sheet.eachRow({ includeEmpty: false }, (row, rowNumber) => {
    const cells = Array.from({ length: width }, (_, i) => cellText(row.getCell(i + 1).value).trim());
    if (cells.some((cell) => cell !== '')) records.push({ line: rowNumber, cells });
  });
  if (records.length < 2) throw new ParseProblem('The first sheet has a header row but no data rows.');
  const headers = records[0]!.cells;
  return { headers, rows: records.slice(1), decimalComma: false, format: `workbook sheet "${sheet.name}"` };
}
