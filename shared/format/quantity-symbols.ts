/** A quantity symbol with a subscript: ΔG with ET, the free energy of photoinduced electron transfer. */
export interface SubscriptedSymbol {
  base: string;
  subscript: string;
}

/** The symbols Halflight writes with a subscript, one home for all outputs (see `symbolText`, `symbolPlain`). */
export const SYMBOLS = {
  drivingForce: { base: 'ΔG', subscript: 'ET' },
} as const satisfies Record<string, SubscriptedSymbol>;

// Unicode's subscript letters and digits (U+2080–U+209C); there are no capital ones.
const SUBSCRIPTS: Record<string, string> = {
  ...Object.fromEntries([...'0123456789'].map((digit, i) => [digit, String.fromCodePoint(0x2080 + i)])),
  a: 'ₐ',
  e: 'ₑ',
  o: 'ₒ',
  x: 'ₓ',
  h: 'ₕ',
  k: 'ₖ',
  l: 'ₗ',
  m: 'ₘ',
  n: 'ₙ',
  p: 'ₚ',
  s: 'ₛ',
  t: 'ₜ',
};

/**
 * The symbol in one line of text, where nothing can be lowered (chart axes drawn on a canvas and
 * their PNG and SVG, the PDF): the subscript in Unicode subscript letters, which exist only in
 * lower case, so ΔG with ET reads "ΔGₑₜ". On screen the subscript is lowered in HTML instead
 * (src/components/subscripted.tsx). A subscript with no Unicode form keeps "_".
 * @example symbolText(SYMBOLS.drivingForce) // 'ΔGₑₜ'
 */
export function symbolText(symbol: SubscriptedSymbol): string {
  const letters = [...symbol.subscript.toLowerCase()].map((char) => SUBSCRIPTS[char]);
  return letters.every(Boolean) ? symbol.base + letters.join('') : symbolPlain(symbol);
}

/**
 * The symbol as a CSV column name: "ΔG_ET", the plain form earlier exports used, kept so scripts
 * that read those files by column name still find it.
 */
export const symbolPlain = (symbol: SubscriptedSymbol): string => `${symbol.base}_${symbol.subscript}`;
