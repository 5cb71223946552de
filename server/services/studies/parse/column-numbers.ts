import { parseCellNumber } from './parse-number';
import type { RawTable } from './read-text-table';

const parsedColumns = new WeakMap<RawTable, Map<number, Array<number | null | undefined>>>();

/**
 * A column's cells as parseCellNumber reads them (number, null for blank, undefined for not a
 * number), worked out once per table and column: a kept table is reduced again for every
 * preview and on apply, and a spectrum matrix holds a million cells. Dropped with the table.
 */
export function columnNumbers(table: RawTable, column: number): ReadonlyArray<number | null | undefined> {
  let columns = parsedColumns.get(table);
  if (!columns) parsedColumns.set(table, (columns = new Map()));
  let values = columns.get(column);
  if (!values) {
    values = table.rows.map((row) => parseCellNumber(row.cells[column] ?? '', table.decimalComma));
    columns.set(column, values);
  }
  return values;
}
