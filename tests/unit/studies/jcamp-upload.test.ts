import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { applyMapping } from '../../../server/services/studies/parse/apply-mapping';
import { ParseProblem } from '../../../server/services/studies/parse/parse-problem';
import { mappingNotes, proposeMapping } from '../../../server/services/studies/parse/propose-mapping';
import { readUpload } from '../../../server/services/studies/parse/read-upload';

// titration-spectra.jdx is invented test data (tests/fixtures/uploads/README.md): block k holds
// (lambda - 400) / (1 + 500 [Q]_k), so every integral and reading below is worked out by hand.
const fixture = fs.readFileSync(path.join(import.meta.dirname, '../../fixtures/uploads/titration-spectra.jdx'));
const jcamp = (lines: string[]) => Buffer.from(`${lines.join('\n')}\n`);
const block = (title: string, labels: string[], xUnits: string, data: string[]) => [
  `##TITLE= ${title}`,
  '##JCAMP-DX= 4.24',
  '##DATA TYPE= UV/VIS SPECTRUM',
  ...labels,
  `##XUNITS= ${xUnits}`,
  '##YUNITS= ARBITRARY UNITS',
  '##XFACTOR= 1',
  '##YFACTOR= 1',
  '##PEAK TABLE= (XY..XY)',
  ...data,
  '##END=',
];

describe('JCAMP-DX uploads (read with jcampconverter)', () => {
  it('when a LINK file holds four blocks, then each becomes a spectrum column with its concentration from title, ##CONCENTRATIONS= or a private label', async () => {
    const table = await readUpload('titration-spectra.jdx', fixture);
    expect(table.format).toBe('JCAMP-DX, 4 spectra on different wavelength grids');
    expect(table.headers).toEqual([
      'wavelength (nm)',
      'HL-Ir-7 blank, [Q] = 0 mM',
      'HL-Ir-7 titration point 2 ([Q] 0.001 M)',
      'HL-Ir-7 titration point 3 ([Q] 0.002 M)',
      'HL-Ir-7 titration point 4',
    ]);
    // block 3 runs 440–560 nm, the others 450–550: 13 wavelengths, blanks where a block has none
    expect(table.rows).toHaveLength(13);
    expect(table.rows[0]!.cells).toEqual(['440', '', '', '20', '']);
    expect(table.rows[1]!.cells).toEqual(['450', '50', '33.333333', '25', '20']);
    const mapping = proposeMapping(table);
    expect(mapping).toEqual({
      layout: 'spectrum',
      wavelength: 0,
      samples: [
        { column: 1, concentration: 0 },
        { column: 2, concentration: 1e-3 },
        { column: 3, concentration: 2e-3 },
      ],
      reduction: { kind: 'window', start: 450, end: 550 },
      baseline: null,
    });
    expect(mappingNotes(table, mapping)).toEqual([
      expect.stringContaining('"HL-Ir-7 titration point 4" names no quencher concentration'),
    ]);
  });

  it('when the window is 450–550 nm, then each intensity is the trapezoid integral 10000 / (1 + 500 [Q]) (hand-computed: [(x-400)^2/2] from 450 to 550 = 10000)', async () => {
    const table = await readUpload('titration-spectra.jdx', fixture);
    const { points, problems } = applyMapping(table, proposeMapping(table));
    expect(problems).toEqual([]);
    expect(points.map((p) => p.intensity)).toEqual([10000, 10000 / 1.5, 5000].map((value) => expect.closeTo(value, 4)));
  });

  it('when the user types the missing concentration and reads at 500 nm, then block 4 gives 100 / (1 + 500 * 3e-3) = 40', async () => {
    const table = await readUpload('titration-spectra.jdx', fixture);
    const base = proposeMapping(table);
    if (base.layout !== 'spectrum') throw new Error('expected a spectrum mapping');
    const mapping = {
      ...base,
      samples: [...base.samples, { column: 4, concentration: 3e-3 }],
      reduction: { kind: 'wavelength' as const, at: 500 },
    };
    const { points, problems } = applyMapping(table, mapping);
    expect(problems).toEqual([]);
    expect(points.map((p) => [p.concentration, p.intensity])).toEqual([
      [0, 100],
      [1e-3, expect.closeTo(66.666667, 5)],
      [2e-3, 50],
      [3e-3, 40],
    ]);
    expect(mappingNotes(table, mapping)).toEqual([]);
  });

  it('when one spectrum is given in wavenumbers, then x becomes nm (1e7 / x) and the title gives the concentration', async () => {
    const table = await readUpload(
      'one.dx',
      jcamp(block('HL-Ir-7 with HL-Q-3 at 0.5 mM', [], '1/CM', ['20000,10', '19000,12', '18000,14'])),
    );
    expect(table.rows.map((row) => Number(row.cells[0]))).toEqual([
      500,
      expect.closeTo(526.3157895, 6),
      expect.closeTo(555.5555556, 6),
    ]);
    const { points } = applyMapping(table, proposeMapping(table));
    expect(points).toEqual([expect.objectContaining({ concentration: 5e-4 })]);
    // trapezoids on the nm axis: (10+12)/2 * 26.3157895 + (12+14)/2 * 29.2397661 = 289.4737 + 380.1170 (hand-computed)
    expect(points[0]!.intensity).toBeCloseTo(669.5906, 3);
  });

  it('when ##CONCENTRATIONS= lists two substances, then no concentration is guessed and the user is asked', async () => {
    const table = await readUpload(
      'two.jdx',
      jcamp(
        block('sample A', ['##CONCENTRATIONS= (NCU)', '(HL-Ir-7, 10, uM)', '(HL-Q-3, 2, mM)'], 'NANOMETERS', [
          '500,1',
          '510,2',
        ]),
      ),
    );
    const mapping = proposeMapping(table);
    expect(mapping).toMatchObject({ layout: 'spectrum', samples: [] });
    expect(mappingNotes(table, mapping)).toHaveLength(1);
    expect(applyMapping(table, mapping)).toEqual({ points: [], problems: [] }); // readable; the apply step refuses an empty series
  });

  const refused: Array<[string, Buffer, RegExp]> = [
    ['plain text', Buffer.from('wavelength,0 mM\n500,1\n'), /should start with a ##TITLE= line/],
    [
      'a time axis',
      jcamp(block('decay 1 mM', [], 'SECONDS', ['0,1', '1,2'])),
      /##XUNITS=SECONDS; Halflight reads NANOMETERS, MICROMETERS or 1\/CM/,
    ],
    [
      'a LINK block without spectra',
      jcamp(['##TITLE= empty', '##JCAMP-DX= 4.24', '##DATA TYPE= LINK', '##BLOCKS= 0', '##END=']),
      /holds no spectrum/,
    ],
    ['binary bytes', Buffer.from([0x23, 0x23, 0, 1, 2]), /binary data/],
  ];
  for (const [what, bytes, message] of refused) {
    it(`when the .jdx file is ${what}, then a ParseProblem says why`, async () => {
      const error = await readUpload('bad.jdx', bytes).catch((caught: unknown) => caught);
      expect(error).toBeInstanceOf(ParseProblem);
      expect((error as Error).message).toMatch(message);
    });
  }
});
