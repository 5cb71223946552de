import { convert, type Entry } from 'jcampconverter';
import { ParseProblem } from './parse-problem';
import { decodeText } from './read-text-table';
import { checkLines } from './scan-lines';
import { limitMessage, UploadLimitExceeded, type UploadLimits } from './upload-limits';

/** JCAMP-DX labels compare without case, spaces, dashes, slashes or underscores (JCAMP-DX 4.24). */
const labelOf = (line: string) =>
  line
    .slice(2, line.indexOf('='))
    .replace(/[\s\-/_]/g, '')
    .toUpperCase();
const DATA_LABELS = new Set(['XYDATA', 'XYPOINTS', 'PEAKTABLE', 'DATATABLE']);
/**
 * One value of an ASDF data line: a SQZ, DIF or DUP pseudo-digit with its digits, or a plain
 * (AFFN) number. DUP (S-Z for 1-8, s for 9, then more digits) repeats the value before it.
 */
const VALUE = /([@A-Ia-i%J-Rj-rS-Zs])(\d*)|[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?/g;
const DUP_DIGITS: Record<string, string> = { S: '1', T: '2', U: '3', V: '4', W: '5', X: '6', Y: '7', Z: '8', s: '9' };

/**
 * Counts, before jcampconverter expands anything, the points each spectrum of a JCAMP-DX file
 * declares (##NPOINTS=) and holds once its run-length (DUP) values are written out, and
 * refuses a file over the limits: 237 bytes can otherwise ask for 10 million points. The count
 * is an upper bound (the x value and the DIF check value of each line count too).
 */
export function checkJcamp(bytes: Buffer, text: string, limits: UploadLimits): void {
  checkLines(bytes, limits, { countRows: false });
  let inData = false;
  let pairs = false;
  let block = 0;
  let title = '';
  let blockPoints = 0;
  let filePoints = 0;
  const refuse = (points: number, declared: boolean) => {
    const what = `Spectrum ${declared ? block + 1 : block}${title ? ` ("${title.slice(0, 60)}")` : ''}`;
    const verb = declared ? 'declares' : 'holds, once its run-length (DUP) values are written out, at least';
    throw new UploadLimitExceeded('spectrumPoints', limitMessage.spectrumPoints(limits, `${what} ${verb}`, points));
  };
  for (const raw of text.split(/\r?\n/)) {
    const line = raw.trim();
    if (line.startsWith('##')) {
      const label = labelOf(line);
      const value = line.slice(line.indexOf('=') + 1).trim();
      if (label === 'TITLE') title = value;
      if (label === 'NPOINTS') {
        const declared = Number(value);
        if (Number.isFinite(declared) && declared > limits.spectrumPoints) refuse(declared, true);
      }
      inData = DATA_LABELS.has(label);
      if (inData) {
        block += 1;
        blockPoints = 0;
        pairs = /XY\.\.XY/i.test(value);
      }
      continue;
    }
    if (!inData) continue;
    const data = line.split('$$')[0]!;
    let values = 0;
    let repeated = 0;
    for (const match of data.matchAll(VALUE)) {
      const dup = match[1] ? DUP_DIGITS[match[1]] : undefined;
      if (dup !== undefined) repeated += Number(dup + match[2]) - 1;
      else values += 1;
    }
    // The first value of an (X++(Y..Y)) line is its x.
    const points = (pairs ? values / 2 : Math.max(0, values - 1)) + repeated;
    blockPoints += points;
    filePoints += points;
    if (blockPoints > limits.spectrumPoints) refuse(blockPoints, false);
    if (filePoints > limits.cells) throw new UploadLimitExceeded('cells', limitMessage.cells(limits));
  }
}

/**
 * The data blocks of a JCAMP-DX file (IUPAC), read with jcampconverter once checkJcamp has let the
 * file through: every block that holds at least one spectrum, in file order. The study reader
 * takes spectra from them, the decay reader decays.
 */
export function readJcampBlocks(bytes: Buffer, limits: UploadLimits): Entry[] {
  const text = decodeText(bytes).replace(/^\uFEFF/, '');
  if (!text.trimStart().startsWith('##'))
    throw new ParseProblem('This is not JCAMP-DX: the file should start with a ##TITLE= line.');
  checkJcamp(bytes, text, limits);
  try {
    return convert(text, { keepRecordsRegExp: /.*/ }).flatten.filter((entry) => entry.spectra.length > 0);
  } catch (error) {
    throw new ParseProblem(`The JCAMP-DX file could not be read: ${(error as Error).message}`);
  }
}
