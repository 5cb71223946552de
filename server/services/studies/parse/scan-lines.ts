import { limitMessage, UploadLimitExceeded, type UploadLimits } from './upload-limits';

const NEWLINE = 0x0a;
const RETURN = 0x0d;
const HASH = 0x23;

/**
 * Walks the raw bytes once, before any text is decoded or split, and refuses a file whose
 * lines are too long or too many: a 19 MB line or 3 million rows are stopped here in
 * milliseconds instead of being turned into millions of strings. Blank lines and # comments
 * do not count as rows.
 */
export function checkLines(
  bytes: Buffer,
  limits: UploadLimits,
  options: { countRows: boolean } = { countRows: true },
): void {
  let start = 0;
  let line = 0;
  let rows = 0;
  while (start < bytes.length) {
    const found = bytes.indexOf(NEWLINE, start);
    const end = found === -1 ? bytes.length : found;
    line += 1;
    const length = end > start && bytes[end - 1] === RETURN ? end - start - 1 : end - start;
    if (length > limits.lineBytes) throw new UploadLimitExceeded('lineBytes', limitMessage.lineBytes(limits, line));
    if (options.countRows && length > 0 && bytes[start] !== HASH) {
      rows += 1;
      // One more than the limit: the header row.
      if (rows > limits.rows + 1) throw new UploadLimitExceeded('rows', limitMessage.rows(limits));
    }
    start = end + 1;
  }
}
