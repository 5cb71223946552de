/**
 * The instrument exports Halflight reads (text tables, .xlsx, JCAMP-DX), as the server checks them
 * (ACCEPTED_EXTENSIONS in server/services/studies/parse/read-upload.ts; tests/component/file-field.test.tsx
 * holds the two lists together). Every file picker for an instrument export offers this list.
 */
export const INSTRUMENT_FILES = '.csv,.tsv,.txt,.dat,.asc,.xlsx,.jdx,.dx,.jcamp';

/** The same list for people to read in a hint: ".csv .tsv … .jcamp". */
export const INSTRUMENT_FILE_NAMES = INSTRUMENT_FILES.split(',').join(' ');
