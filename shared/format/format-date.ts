/*
 * Dates in one format: on screen in the reader's own locale (medium date, short time), in
 * exports (CSV, PDF, file names) as ISO 8601 in UTC, which every program and country reads the
 * same way.
 */

type DateInput = string | number | Date;
const asDate = (input: DateInput) => (input instanceof Date ? input : new Date(input));
const valid = (date: Date) => !Number.isNaN(date.getTime());

const formats = new Map<string, Intl.DateTimeFormat>();
function formatter(locale: string | undefined, style: 'date' | 'dateTime'): Intl.DateTimeFormat {
  const key = `${locale ?? ''}|${style}`;
  let format = formats.get(key);
  if (!format) {
    format = new Intl.DateTimeFormat(
      locale,
      style === 'date' ? { dateStyle: 'medium' } : { dateStyle: 'medium', timeStyle: 'short' },
    );
    formats.set(key, format);
  }
  return format;
}

/** "4 Mar 2026" (en-GB), "Mar 4, 2026" (en-US): the reader's locale unless one is given. */
export const formatDate = (input: DateInput, locale?: string): string =>
  valid(asDate(input)) ? formatter(locale, 'date').format(asDate(input)) : '—';

/** "4 Mar 2026, 14:05" in the reader's locale and time zone. */
export const formatDateTime = (input: DateInput, locale?: string): string =>
  valid(asDate(input)) ? formatter(locale, 'dateTime').format(asDate(input)) : '—';

/** ISO 8601 date in UTC for exports. @example isoDate('2026-03-04T23:30:00Z') // '2026-03-04' */
export const isoDate = (input: DateInput): string =>
  valid(asDate(input)) ? asDate(input).toISOString().slice(0, 10) : '';

/** ISO 8601 date and minute in UTC for exports. @example isoDateTime('2026-03-04T14:05:09Z') // '2026-03-04 14:05 UTC' */
export const isoDateTime = (input: DateInput): string =>
  valid(asDate(input)) ? `${asDate(input).toISOString().slice(0, 16).replace('T', ' ')} UTC` : '';
