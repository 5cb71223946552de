import { describe, expect, it } from 'vitest';
import { neutraliseCell, restoreCell } from '../../../server/lib/csv-cells';
import { cellValue, csvDelimiter } from '../../../server/services/library/library-csv';

describe('neutraliseCell', () => {
  // OWASP "CSV Injection": cells beginning with =, +, -, @ are prefixed so spreadsheets read them as text.
  it('when a text cell starts with = + - or @, then it gets a leading apostrophe', () => {
    expect(['=SUM(A1)', '+cmd', '-2+3', '@SUM(1)'].map(neutraliseCell)).toEqual([
      "'=SUM(A1)",
      "'+cmd",
      "'-2+3",
      "'@SUM(1)",
    ]);
  });

  it('when a cell is a plain signed number such as a potential, then it stays as written', () => {
    expect(['-1.21', '+0.38', '-2e-7', 'HL-Ir-7'].map(neutraliseCell)).toEqual(['-1.21', '+0.38', '-2e-7', 'HL-Ir-7']);
  });

  it('when an exported cell is read back, then the original text returns', () => {
    for (const text of ['=HYPERLINK("x")', '@home', 'plain']) expect(restoreCell(neutraliseCell(text))).toBe(text);
  });
});

describe('cellValue', () => {
  it('when a numeric column holds text, then the text is passed on for the schema to refuse; empty cells are absent', () => {
    expect(cellValue('potential_v', ' -1.05 ')).toBe(-1.05);
    expect(cellValue('potential_v', 'minus one')).toBe('minus one');
    expect(cellValue('potential_v', '')).toBeUndefined();
    expect(cellValue('notes', "'=1+1")).toBe('=1+1');
  });
});

// Spreadsheets in decimal-comma locales save "CSV" with ';' between cells and ',' as the decimal
// sign (common practice; e.g. German or French regional settings), so "-1,05" means -1.05.
describe('csvDelimiter and decimal commas', () => {
  it('when the header is separated by semicolons, then the file is read with ";"; otherwise with ","', () => {
    expect(csvDelimiter('record;compound;potential_v\npotential;HL-Ir-7;-1,05')).toBe(';');
    expect(csvDelimiter('\uFEFFrecord;compound\r\ncompound;HL-Ir-7')).toBe(';');
    expect(csvDelimiter('record,compound,potential_v\npotential,HL-Ir-7,-1.05')).toBe(',');
    expect(csvDelimiter('record,compound,notes\ncompound,HL-Ir-7,a;b')).toBe(',');
  });

  it('when a numeric cell of a ";" file has a decimal comma, then it becomes that number', () => {
    expect(cellValue('potential_v', '-1,05', true)).toBe(-1.05);
    expect(cellValue('lifetime_s', '1,1e-6', true)).toBe(1.1e-6);
    expect(cellValue('wavelength_nm', '475', true)).toBe(475);
    expect(cellValue('potential_v', '-1.05', true)).toBe(-1.05);
  });

  it('when a comma is not a single decimal sign, or the file is comma separated, then the text goes on for the schema to refuse', () => {
    expect(cellValue('wavelength_nm', '1.234,5', true)).toBe('1.234,5');
    expect(cellValue('potential_v', '1,2,3', true)).toBe('1,2,3');
    expect(cellValue('potential_v', '-1,05', false)).toBe('-1,05');
    // Text columns keep their commas.
    expect(cellValue('electrolyte', '0,1 M Bu4NPF6', true)).toBe('0,1 M Bu4NPF6');
  });
});
