import { describe, expect, it } from 'vitest';
import { neutraliseCell, restoreCell } from '../../../server/lib/csv-cells';
import { cellValue } from '../../../server/services/library/library-csv';

describe('neutraliseCell', () => {
  // OWASP "CSV Injection": cells beginning with =, +, -, @ are prefixed so spreadsheets read them as text.
  it('when a text cell starts with = + - or @, then it gets a leading apostrophe', () => {
    expect(['=SUM(A1)', '+cmd', '-2+3', '@SUM(1)'].map(neutraliseCell)).toEqual(["'=SUM(A1)", "'+cmd", "'-2+3", "'@SUM(1)"]);
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
