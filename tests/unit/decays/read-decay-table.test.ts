import { describe, expect, it } from 'vitest';
import { readDecayTable } from '../../../server/services/decays/read-decay-table';
import { DEFAULT_UPLOAD_LIMITS } from '../../../server/services/studies/parse/upload-limits';

const read = (name: string, text: string) => readDecayTable(name, Buffer.from(text), DEFAULT_UPLOAD_LIMITS);

describe('readDecayTable', () => {
  it('when the time header says µs and a column is named prompt, then the unit is us and that column is the response', async () => {
    const table = await read('d.txt', 'Time / µs\tprompt\tsample 0.25 mM\n0\t5\t1\n0.5\t900\t20\n1.0\t40\t800\n');
    expect(table.timeUnit).toBe('us');
    expect(table.time).toEqual([0, 0.5, 1]);
    expect(table.columns.map(({ role, concentration }) => [role, concentration])).toEqual([
      ['response', null],
      ['decay', 0.25e-3],
    ]);
  });

  it('when a JCAMP-DX file holds a decay on a NANOSECONDS axis, then it reads as one decay in ns', async () => {
    // ##XYDATA=(X++(Y..Y)) in AFFN (JCAMP-DX 4.24, McDonald & Wilks, Appl. Spectrosc. 1988, 42, 151)
    const jcamp = [
      '##TITLE=emitter 1.5 mM',
      '##JCAMP-DX=4.24',
      '##DATA TYPE=DECAY',
      '##XUNITS=NANOSECONDS',
      '##YUNITS=COUNTS',
      '##XFACTOR=1',
      '##YFACTOR=1',
      '##FIRSTX=0',
      '##LASTX=0.3',
      '##NPOINTS=4',
      '##XYDATA=(X++(Y..Y))',
      '0 10 900 400 150',
      '##END=',
    ].join('\n');
    const table = await read('d.jdx', jcamp);
    expect(table.timeUnit).toBe('ns');
    expect(table.time).toHaveLength(4);
    expect(table.columns[0]).toMatchObject({ role: 'decay', counts: [10, 900, 400, 150] });
    expect(table.columns[0]!.concentration).toBeCloseTo(1.5e-3, 12);
  });

  it('when channels are not evenly spaced, then the problem names it', async () => {
    await expect(read('d.csv', 'time (ns),counts\n0,1\n1,2\n2,3\n5,4\n')).rejects.toThrow(/not evenly spaced/);
  });
});
