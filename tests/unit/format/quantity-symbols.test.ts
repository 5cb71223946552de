import { describe, expect, it } from 'vitest';
import { SYMBOLS, symbolPlain, symbolText } from '@shared/format';

// Code points from the Unicode Standard, block "Superscripts and Subscripts" (U+2070–U+209F):
// U+2091 LATIN SUBSCRIPT SMALL LETTER E, U+209C LATIN SUBSCRIPT SMALL LETTER T, U+2080–U+2089 the
// subscript digits; the block has no capital subscript letters.

describe('symbolText', () => {
  it('when the driving force is written in one line, then ET becomes the subscript letters e and t, with no underscore', () => {
    const text = symbolText(SYMBOLS.drivingForce);
    expect(text).toBe('ΔG\u2091\u209c');
    expect(text).not.toContain('_');
  });

  it('when a subscript has digits, then they become subscript digits', () => {
    expect(symbolText({ base: 'E', subscript: '00' })).toBe('E\u2080\u2080');
  });

  it('when a subscript letter has no Unicode subscript form, then the plain form is kept rather than a half-converted one', () => {
    expect(symbolText({ base: 'k', subscript: 'q' })).toBe('k_q');
  });
});

describe('symbolPlain', () => {
  it('when the driving force names a CSV column, then it is ΔG_ET as in earlier exports', () => {
    expect(symbolPlain(SYMBOLS.drivingForce)).toBe('ΔG_ET');
  });
});
