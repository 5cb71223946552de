import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { applyMapping } from '../../../server/services/studies/parse/apply-mapping';
import { concentrationInHeader, headerUnit } from '../../../server/services/studies/parse/header-units';
import { ParseProblem } from '../../../server/services/studies/parse/parse-problem';
import { proposeMapping } from '../../../server/services/studies/parse/propose-mapping';
import { readUpload } from '../../../server/services/studies/parse/read-upload';
import { integrateWindow, valueAt } from '../../../server/services/studies/parse/reduce-spectrum';

// Fixtures are invented test data built from exact Stern–Volmer lines (tests/fixtures/uploads/README.md).
const fixture = (name: string) => fs.readFileSync(path.join(import.meta.dirname, '../../fixtures/uploads', name));
/** Reads a fixture with the proposed mapping; `unit` answers the preview's question when a header names none. */
const read = async (name: string, unit?: 'M') => {
  const table = await readUpload(name, fixture(name));
  const proposed = proposeMapping(table);
  const mapping = unit && proposed.layout === 'series' ? { ...proposed, concentrationUnit: unit } : proposed;
  return { table, mapping, ...applyMapping(table, mapping) };
};

describe('header units', () => {
  it('when a header carries a unit in brackets, after a slash or an underscore, then it is read (micro sign and u alike)', () => {
    expect(headerUnit('[Q] (mM)')).toBe('mM');
    expect(headerUnit('c / µM')).toBe('uM');
    expect(headerUnit('tau_ns')).toBe('ns');
    expect(headerUnit('lifetime [us]')).toBe('us');
    expect(headerUnit('intensity')).toBeNull();
  });
  it('when a spectrum header names a concentration, then it becomes mol/L', () => {
    expect(concentrationInHeader('1.5 mM')).toBeCloseTo(1.5e-3, 15);
    expect(concentrationInHeader('[Q]=2,0 uM')).toBeCloseTo(2e-6, 15);
    expect(concentrationInHeader('wavelength (nm)')).toBeNull();
  });
});

describe('reading fixture files', () => {
  it('when the file is comma-separated with mM, then concentrations come out in mol/L', async () => {
    const { points, problems, table } = await read('series-comma-mM.csv');
    expect(problems).toEqual([]);
    expect(table.format).toMatch(/comma/);
    expect(points.map((p) => p.concentration)).toEqual(
      [0, 5e-4, 1e-3, 1.5e-3, 2e-3, 3e-3].map((q) => expect.closeTo(q, 15)),
    );
    expect(points[1]!.intensity).toBeCloseTo(800, 6); // 1000 / (1 + 500 * 5e-4)
  });
  it('when the file has a BOM, semicolons, decimal commas, µM and ns, then all are understood', async () => {
    const { points, problems, mapping, table } = await read('series-semicolon-decimal-comma-bom.csv');
    expect(problems).toEqual([]);
    expect(table.headers[0]).toBe('c / µM');
    expect(table.decimalComma).toBe(true);
    expect(mapping).toMatchObject({ layout: 'series', concentrationUnit: 'uM', lifetimeUnit: 'ns', lifetime: 2 });
    expect(points[2]!.concentration).toBeCloseTo(2e-4, 15);
    expect(points[2]!.intensity).toBeCloseTo(5000 / 1.2, 3);
    expect(points[2]!.lifetime).toBeCloseTo(1100e-9 / 1.2, 12);
  });
  it('when a column is headed I0/I, then it is mapped as ratios', async () => {
    const { mapping, points } = await read('series-tab-ratio.tsv');
    expect(mapping).toMatchObject({ layout: 'series', intensityIsRatio: true, uncertainty: 2 });
    expect(points[5]!.intensity).toBeCloseTo(1 + 800 * 5e-3, 6);
  });
  it('when columns are separated by spaces without a header, then columns are taken by position', async () => {
    const proposed = proposeMapping(await readUpload('series-whitespace.txt', fixture('series-whitespace.txt')));
    expect(proposed).toMatchObject({ layout: 'series', concentrationUnit: null }); // no header, so no unit: the user chooses
    const { points, problems, table } = await read('series-whitespace.txt', 'M');
    expect(problems).toEqual([]);
    expect(table.format).toMatch(/whitespace/);
    expect(points).toHaveLength(5);
    expect(points[4]!.concentration).toBeCloseTo(8e-3, 15);
  });
  it('when the file is an .xlsx workbook, then its first sheet is read', async () => {
    const { points, problems } = await read('series-workbook.xlsx');
    expect(problems).toEqual([]);
    expect(points[5]!.intensity).toBeCloseTo(400, 9);
  });
  it('when the file is a spectrum matrix, then each sample is integrated over the window (trapezoid, exact for a linear spectrum)', async () => {
    const { mapping, points } = await read('spectrum-matrix.csv');
    expect(mapping).toMatchObject({ layout: 'spectrum', reduction: { kind: 'window', start: 450, end: 550 } });
    // integral of (lambda - 400) from 450 to 550 = (150^2 - 50^2) / 2 = 10000 (hand-computed)
    expect(points.map((p) => p.intensity)).toEqual([10000, 10000 / 1.5, 5000, 4000].map((v) => expect.closeTo(v, 5)));
  });
});

describe('problems name row and column', () => {
  it('when a number cell holds text, then the row and column are named with what was expected', async () => {
    const { problems } = await read('bad-text-in-number.csv');
    expect(problems[0]!.message).toBe('Row 3, column 2 ("intensity"): expected an intensity, found "abc".');
  });
  it('when a concentration is negative, then that cell is named', async () => {
    const { problems } = await read('bad-negative-concentration.csv');
    expect(problems[0]!.message).toMatch(
      /^Row 3, column 1 \("\[Q\] \(mM\)"\): expected a concentration of zero or more/,
    );
  });
  it('when rows have fewer cells than the header, then the row is named', async () => {
    await expect(readUpload('x.csv', fixture('bad-mismatched-columns.csv'))).rejects.toThrow(
      'Row 3 has 2 cells where the header has 3 columns.',
    );
  });
  it('when there is only a header, or nothing, or binary bytes, then the problem says so', async () => {
    await expect(readUpload('x.csv', fixture('bad-header-only.csv'))).rejects.toThrow(/no data rows/);
    await expect(readUpload('x.csv', Buffer.alloc(0))).rejects.toThrow('The file is empty.');
    await expect(readUpload('x.csv', Buffer.from([0x89, 0x50, 0x00, 0xff, 0x10]))).rejects.toBeInstanceOf(ParseProblem);
  });
});

describe('spectrum reduction', () => {
  it('when a window falls between readings, then its edges are interpolated (hand-computed integral of 2x over 1.5..3.5 = 3.5^2 - 1.5^2 = 10)', () => {
    expect(integrateWindow([1, 2, 3, 4], [2, 4, 6, 8], 1.5, 3.5)).toBeCloseTo(10, 12);
  });
  it('when reading one wavelength between two points, then it is linearly interpolated', () => {
    expect(valueAt([500, 510], [100, 200], 504)).toBeCloseTo(140, 12);
    expect(() => valueAt([500, 510], [1, 2], 520)).toThrow(/outside the spectrum/);
  });
  it('when the readings come in descending or shuffled order, then the integral is the same (trapezoid of 2x over 1.5..3.5 = 10, hand-computed)', () => {
    expect(integrateWindow([4, 3, 2, 1], [8, 6, 4, 2], 1.5, 3.5)).toBeCloseTo(10, 12);
    expect(integrateWindow([3, 1, 4, 2], [6, 2, 8, 4], 1.5, 3.5)).toBeCloseTo(10, 12);
  });
  it('when a long spectrum is integrated, then the trapezoid sum matches the exact integral of a straight line', () => {
    // y = 3x + 1 over 400..800 nm read every 0.1 nm: exact integral 1.5 (700^2 - 450^2) + (700 - 450) = 431,500 (hand-computed)
    const x = Array.from({ length: 4001 }, (_, i) => 400 + i / 10);
    expect(
      integrateWindow(
        x,
        x.map((value) => 3 * value + 1),
        450.05,
        700,
      ),
    ).toBeCloseTo(1.5 * (700 ** 2 - 450.05 ** 2) + (700 - 450.05), 6);
    expect(
      valueAt(
        x,
        x.map((value) => 3 * value + 1),
        612.34,
      ),
    ).toBeCloseTo(3 * 612.34 + 1, 9);
  });
});

describe('ragged rows are found before the delimiter is chosen', () => {
  it('when one row of a comma file is short, then the file is still read as comma-separated and that row is named', async () => {
    const text = '[Q] (mM),intensity,tau (ns)\n0,1000,500\n1,800,400\n2\n3,550,310\n4,480,270\n';
    await expect(readUpload('x.csv', Buffer.from(text))).rejects.toThrow(
      'Row 4 has 1 cell where the header has 3 columns. The file was read as comma-separated, as most of its lines are.',
    );
  });
  it('when several rows are ragged, then each is named by its line', async () => {
    const text = 'c;I\n0;100\n1\n2;80;7\n3;70\n4\n';
    await expect(readUpload('x.csv', Buffer.from(text))).rejects.toThrow(/^Row 3 has 1 cell .* Rows 4, 6 differ too\./);
  });
  it('when exactly two rows are ragged, then the second is named in the singular', async () => {
    const text = 'c (mM),I\n0,1000\n1\n2\n3,700\n';
    await expect(readUpload('x.csv', Buffer.from(text))).rejects.toThrow(
      'Row 3 has 1 cell where the header has 2 columns. Row 4 differs too. The file was read as comma-separated, as most of its lines are.',
    );
  });
  it('when a tab file has a short row and a decimal comma, then it stays tab-separated and names the row', async () => {
    const text = 'c (mM)\tI\n0\t1000,5\n1\n2\t700,1\n3\t650,2\n';
    await expect(readUpload('x.tsv', Buffer.from(text))).rejects.toThrow(
      'Row 3 has 1 cell where the header has 2 columns. The file was read as tab-separated, as most of its lines are.',
    );
  });
});
