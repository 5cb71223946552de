import { describe, expect, it } from 'vitest';
import { isStorableText, storableInput } from '../../../shared/schemas/storable-text';

// Surrogate pairs as defined by the Unicode Standard, section 3.8 "Surrogates": a high surrogate
// (U+D800–U+DBFF) must be followed by a low one (U+DC00–U+DFFF) and a low one preceded by a high one.
describe('isStorableText', () => {
  it('when text is well-formed, including astral characters written as pairs, then it is storable', () => {
    for (const text of ['', 'plain', 'Ir(ppy)₃ données μM', '🧪 test tube (U+1F9EA, a pair)', '\uD83E\uDDEA']) {
      expect(isStorableText(text), JSON.stringify(text)).toBe(true);
    }
  });
  it('when text holds NUL or a surrogate without its partner, then it is not', () => {
    for (const text of ['a\u0000b', '\u0000', 'a\uD800', '\uDC00b', 'x\uDC00\uD800y', '\uD83E\uD83E\uDDEA']) {
      expect(isStorableText(text), JSON.stringify(text)).toBe(false);
    }
  });
});

describe('storableInput', () => {
  it('when strings are nested in objects and arrays, then each bad one is named by its path, keys too', () => {
    const result = storableInput.safeParse({ title: 'ok', points: [{ note: 'bad\u0000' }], ['key\uD800']: 1 });
    expect(result.success).toBe(false);
    expect(result.error!.issues.map((issue) => issue.path.join('.')).sort()).toEqual(['key\uD800', 'points.0.note']);
  });
  it('when a value is nested a hundred thousand levels deep, then the check finishes without overflowing the stack', () => {
    let deep: unknown = 'bottom\u0000';
    for (let level = 0; level < 100_000; level++) deep = [deep];
    const result = storableInput.safeParse(deep);
    expect(result.success).toBe(false);
    expect(result.error!.issues[0]!.path).toHaveLength(100_000);
  });
  it('when everything is well-formed, then the value passes through unchanged', () => {
    const value = { name: 'Ru(bpy)₃²⁺', tags: ['a', 'b'], count: 3, none: null };
    expect(storableInput.parse(value)).toEqual(value);
  });
});
