import { describe, expect, it } from 'vitest';
import { readAndMap } from '../../../server/services/studies/parse/read-and-map';
import { readUpload } from '../../../server/services/studies/parse/read-upload';
import { DEFAULT_UPLOAD_LIMITS, UploadLimitExceeded } from '../../../server/services/studies/parse/upload-limits';

const limits = { ...DEFAULT_UPLOAD_LIMITS, rows: 50, columns: 10, cells: 200, spectrumPoints: 1000, seriesPoints: 20 };
const refusal = (fileName: string, text: string, within = limits) =>
  readUpload(fileName, Buffer.from(text), within).then(
    () => {
      throw new Error('expected the file to be refused');
    },
    (error: unknown) => error as UploadLimitExceeded,
  );

const jcamp = (npoints: number, data: string, lastX = 500) =>
  [
    '##TITLE=invented block',
    '##JCAMP-DX=4.24',
    '##XUNITS=NANOMETERS',
    '##YUNITS=ARBITRARY UNITS',
    '##FIRSTX=400',
    `##LASTX=${lastX}`,
    '##XFACTOR=1',
    '##YFACTOR=1',
    `##NPOINTS=${npoints}`,
    '##XYDATA=(X++(Y..Y))',
    data,
    '##END=',
  ].join('\n');

describe('reading limits, checked while reading', () => {
  it('when a JCAMP-DX block declares more points than the limit, then it is refused before expansion', async () => {
    const error = await refusal('a.jdx', jcamp(5000, '400 1 2 3'));
    expect(error).toBeInstanceOf(UploadLimitExceeded);
    expect(error).toMatchObject({ limit: 'spectrumPoints' });
    expect(error.message).toMatch(/declares 5,000 points; Halflight reads at most 1,000 points per spectrum/);
  });
  it('when a run-length (DUP) value expands past the limit under a modest ##NPOINTS, then the expansion is named', async () => {
    // ASDF: "@" is 0, "s999" repeats it 999 more times, twice on the line: 1 + 998 + 1 + 998 values, over 1,000.
    const error = await refusal('a.jdx', jcamp(100, '400@s999@s999'));
    expect(error).toMatchObject({ limit: 'spectrumPoints' });
    expect(error.message).toMatch(/run-length \(DUP\)/);
  });
  it('when a DUP line stays within the limit, then the block is read in full (ASDF: @ = 0, A = 1, T = repeat twice)', async () => {
    const table = await readUpload('a.jdx', Buffer.from(jcamp(4, '400@AT\n403A', 403)), limits);
    // 400: 0, 401: 1, 402: 1 (DUP), 403: 1 (the repeated x check value)
    expect(table.rows.map((row) => row.cells)).toEqual([
      ['400', '0'],
      ['401', '1'],
      ['402', '1'],
      ['403', '1'],
    ]);
  });
  it('when a row has more columns than the limit, then that row is named', async () => {
    const error = await refusal('a.csv', `a,b\n1,2\n${Array.from({ length: 12 }, () => '1').join(',')}\n`);
    expect(error).toMatchObject({ limit: 'columns' });
    expect(error.message).toBe('Row 3 has 12 columns; Halflight reads at most 10 columns.');
  });
  it('when a file has more rows than the limit, then it is refused naming the limit', async () => {
    const error = await refusal('a.csv', `a,b\n${'1,2\n'.repeat(60)}`);
    expect(error).toMatchObject({ limit: 'rows' });
    expect(error.message).toMatch(/more than 50 rows/);
  });
  it('when a line is longer than the limit, then its line number is named', async () => {
    const error = await refusal('a.csv', `a,b\n1,2\n${'1'.repeat(300)}\n`, { ...limits, lineBytes: 256 });
    expect(error).toMatchObject({ limit: 'lineBytes' });
    expect(error.message).toMatch(/^Line 3 is longer than/);
  });
  it('when a mapping gives more points than a series holds, then the outcome names that limit', async () => {
    const text = `[Q] (mM),intensity\n${Array.from({ length: 30 }, (_, i) => `${i},${1000 - i}`).join('\n')}\n`;
    const outcome = await readAndMap({ fileName: 'a.csv', bytes: Buffer.from(text), mapping: null, limits });
    expect(outcome).toMatchObject({ kind: 'limit', limit: 'seriesPoints' });
  });
});
