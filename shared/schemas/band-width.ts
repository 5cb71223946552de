import { z } from 'zod';

/*
 * The band width of a spectrum analysis (an emission matrix or an absorption titration): spectra
 * are averaged over bands this many nm wide before they are compared; 0 keeps one band per
 * wavelength. Each kind has its own largest width.
 */

const DESCRIPTION = 'nm; 0 gives one band per wavelength';
const NOT_A_NUMBER = 'must be a number of nanometres';
const NEGATIVE = 'must be 0 (one band per wavelength) or more';
const tooWide = (max: number) => `must be at most ${max} nm`;

/** A band width sent as a JSON number (analysing a kept record again): 0 to `max` nm, required. */
export function bandWidthSchema(max: number) {
  return z.number({ error: NOT_A_NUMBER }).min(0, NEGATIVE).max(max, tooWide(max)).describe(DESCRIPTION);
}

/**
 * A band width typed in an upload form: it arrives as text, and an empty field (or null) means
 * "not given" and takes `defaultNm`, never 0.
 */
export function bandWidthFormSchema(max: number, defaultNm: number) {
  return z
    .preprocess(
      (value) => (value === '' || value === null ? undefined : value),
      z.coerce.number({ error: NOT_A_NUMBER }).min(0, NEGATIVE).max(max, tooWide(max)).default(defaultNm),
    )
    .describe(DESCRIPTION);
}
