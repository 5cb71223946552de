/**
 * A number cell as instruments write it: optional sign, decimal point or (when the file uses
 * them) decimal comma, optional exponent. Empty cells are null; anything else is undefined
 * (the caller names row and column).
 */
export function parseCellNumber(text: string, decimalComma: boolean): number | null | undefined {
  const trimmed = text.trim();
  if (trimmed === '') return null;
  const normalised = decimalComma ? trimmed.replace(',', '.') : trimmed;
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(normalised)) return undefined;
  const value = Number(normalised);
  return Number.isFinite(value) ? value : undefined;
}

/** True when a cell looks like a number written with a decimal comma, e.g. "0,25" or "1,5E-3". */
export const looksLikeDecimalComma = (text: string) => /^[+-]?\d+,\d+([eE][+-]?\d+)?$/.test(text.trim());
