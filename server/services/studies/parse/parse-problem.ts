/** A reason a file cannot be read, pointing at the row (1-based line of the file) and column. */
export class ParseProblem extends Error {
  constructor(
    message: string,
    readonly row: number | null = null,
    readonly column: string | null = null,
  ) {
    super(message);
    this.name = 'ParseProblem';
  }
}

/** "Row 5, column 2 (intensity): expected a number, found "abc"." */
export function cellProblem(row: number, column: string, expected: string, found: string): ParseProblem {
  return new ParseProblem(
    `Row ${row}, column ${column}: expected ${expected}, found "${found.slice(0, 40)}".`,
    row,
    column,
  );
}
