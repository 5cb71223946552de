const dateFormat = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium' });
const dateTimeFormat = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });

/** "4 Mar 2026" in the reader's own locale. */
export const formatDate = (iso: string) => dateFormat.format(new Date(iso));

/** "4 Mar 2026, 14:05" in the reader's own locale. */
export const formatDateTime = (iso: string) => dateTimeFormat.format(new Date(iso));
