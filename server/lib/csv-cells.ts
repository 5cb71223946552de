import { stringify } from 'csv-stringify/sync';

const plainNumber = /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i;

/**
 * Spreadsheet programs run a cell that starts with = + - @ (or a tab or carriage return) as a
 * formula, so such text gets a leading apostrophe (OWASP "CSV injection" advice). Plain numbers
 * such as -1.21 cannot be formulas and stay as they are.
 */
export function neutraliseCell(value: unknown): string {
  if (value === null || value === undefined) return '';
  const text = String(value);
  if (plainNumber.test(text)) return text;
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

/** Undoes neutraliseCell, so an exported file imports back unchanged. */
export function restoreCell(value: string): string {
  return /^'[=+\-@\t\r]/.test(value) ? value.slice(1) : value;
}

/**
 * Rows to CSV text, every cell neutralised. The text starts with a UTF-8 byte-order mark, so
 * spreadsheet programs read the units (M⁻¹ s⁻¹, µL) as written rather than guessing a legacy code page.
 */
export const csvTable = (rows: readonly (readonly unknown[])[]): string =>
  `\uFEFF${stringify(rows.map((row) => row.map(neutraliseCell)))}`;
