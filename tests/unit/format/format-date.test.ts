import { describe, expect, it } from 'vitest';
import { formatDate, formatDateTime, isoDate, isoDateTime } from '@shared/format';

// Expected strings: ISO 8601 for exports; on screen the locale's own medium date as produced by
// the ECMAScript Intl.DateTimeFormat of this Node (ICU data), checked for two locales.
describe('dates', () => {
  const at = '2026-03-04T14:05:09.000Z';

  it('when a date goes into an export, then it is ISO 8601 in UTC whatever the locale', () => {
    expect(isoDate(at)).toBe('2026-03-04');
    expect(isoDateTime(at)).toBe('2026-03-04 14:05 UTC');
    expect(isoDate(new Date('2026-03-04T23:30:00Z'))).toBe('2026-03-04');
  });

  it('when a date is shown on screen, then it follows the reader’s locale', () => {
    expect(formatDate(at, 'en-GB')).toBe('4 Mar 2026');
    expect(formatDate(at, 'en-US')).toBe('Mar 4, 2026');
    expect(formatDateTime(at, 'en-GB')).toMatch(/^4 Mar 2026, \d\d:\d\d$/);
  });

  it('when the input is not a date, then a dash (screen) or nothing (export) stands in', () => {
    expect(formatDate('not a date')).toBe('—');
    expect(isoDateTime('not a date')).toBe('');
  });
});
