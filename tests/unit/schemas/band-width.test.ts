import { describe, expect, it } from 'vitest';
import { bandWidthFormSchema, bandWidthSchema } from '../../../shared/schemas/band-width';
import { MAX_ABSORPTION_BAND_WIDTH_NM } from '../../../shared/schemas/absorption-titrations';
import { MAX_BAND_WIDTH_NM } from '../../../shared/schemas/spectrum-matrices';

const messagesOf = (result: { success: boolean; error?: { issues: { message: string }[] } }) =>
  result.success ? [] : result.error!.issues.map((issue) => issue.message);

describe('bandWidthSchema(max)', () => {
  const schema = bandWidthSchema(50);

  it('when the width is 0, a fraction or exactly the largest, then it is kept as given', () => {
    for (const width of [0, 2.5, 50]) expect(schema.parse(width)).toBe(width);
  });

  it('when the width is below 0 or above the largest, then the message says which bound', () => {
    expect(messagesOf(schema.safeParse(-1))).toEqual(['must be 0 (one band per wavelength) or more']);
    expect(messagesOf(schema.safeParse(50.5))).toEqual(['must be at most 50 nm']);
  });

  it('when the width is text, missing or not finite, then it is refused as not a number (no coercion in JSON)', () => {
    for (const value of ['5', undefined, null, Number.NaN]) {
      expect(messagesOf(schema.safeParse(value)), String(value)).toEqual(['must be a number of nanometres']);
    }
  });

  it('when each reanalysis uses its own largest width, then the message names that width', () => {
    expect(messagesOf(bandWidthSchema(MAX_BAND_WIDTH_NM).safeParse(MAX_BAND_WIDTH_NM + 1))).toEqual([
      `must be at most ${MAX_BAND_WIDTH_NM} nm`,
    ]);
    expect(messagesOf(bandWidthSchema(MAX_ABSORPTION_BAND_WIDTH_NM).safeParse(MAX_BAND_WIDTH_NM))).toEqual([
      `must be at most ${MAX_ABSORPTION_BAND_WIDTH_NM} nm`,
    ]);
  });
});

describe('bandWidthFormSchema(max, default)', () => {
  const schema = bandWidthFormSchema(100, 10);

  it('when the field is empty, null or absent, then the default is taken, never 0', () => {
    for (const value of ['', null, undefined]) expect(schema.parse(value), String(value)).toBe(10);
  });

  it('when the field holds a number as text, then it is read as that number, 0 included', () => {
    expect(schema.parse('0')).toBe(0);
    expect(schema.parse('12.5')).toBe(12.5);
    expect(schema.parse(100)).toBe(100);
  });

  it('when the text is not a number or out of bounds, then the message names the problem', () => {
    expect(messagesOf(schema.safeParse('wide'))).toEqual(['must be a number of nanometres']);
    expect(messagesOf(schema.safeParse('-0.1'))).toEqual(['must be 0 (one band per wavelength) or more']);
    expect(messagesOf(schema.safeParse('101'))).toEqual(['must be at most 100 nm']);
  });
});
