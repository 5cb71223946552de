import type { LibraryCsvColumn } from '@shared/schemas/library-import';
import { restoreCell } from '../../lib/csv-cells';

/** Which CSV column carries which schema field, per record kind (problems are reported by column). */
export const fieldColumns = {
  compound: {
    name: 'compound',
    roleHint: 'role_hint',
    smiles: 'smiles',
    formula: 'formula',
    emissiveState: 'emissive_state',
    tripletEnergy: 'triplet_energy_ev',
    tripletEnergySource: 'source',
    charge: 'charge',
    notes: 'notes',
  },
  potential: {
    couple: 'couple',
    value: 'potential_v',
    reference: 'reference',
    solvent: 'solvent',
    electrolyte: 'electrolyte',
    kind: 'kind',
    source: 'source',
    notes: 'notes',
  },
  lifetime: {
    value: 'lifetime_s',
    uncertainty: 'uncertainty_s',
    solvent: 'solvent',
    atmosphere: 'atmosphere',
    temperature: 'temperature_k',
    method: 'method',
    source: 'source',
    notes: 'notes',
  },
  e00: { value: 'e00_ev', wavelength: 'wavelength_nm', method: 'method', source: 'source', notes: 'notes' },
} as const satisfies Record<string, Record<string, LibraryCsvColumn>>;

export const numericColumns = new Set<LibraryCsvColumn>([
  'triplet_energy_ev',
  'charge',
  'potential_v',
  'lifetime_s',
  'uncertainty_s',
  'temperature_k',
  'e00_ev',
  'wavelength_nm',
]);

/**
 * The separator of the file, read from its header line: ';' when the header has semicolons and
 * no commas (spreadsheets set to a decimal-comma locale save CSV so), else ','.
 */
export function csvDelimiter(csv: string): ',' | ';' {
  const header = csv.replace(/^\uFEFF/, '').split(/\r?\n/, 1)[0] ?? '';
  return header.includes(';') && !header.includes(',') ? ';' : ',';
}

// One comma between digits, as in "-1,05" or "2,5e-6"; "1.234,5" (grouped thousands) stays text for the schema to refuse.
const decimalCommaNumber = /^[-+]?\d+,\d+(e[-+]?\d+)?$/i;

/**
 * A cell as the schema wants it: empty → absent, numeric columns → number (or the text, which the
 * schema refuses). In a ';'-separated file a decimal comma is read as the decimal point.
 */
export function cellValue(column: LibraryCsvColumn, raw: string | undefined, decimalComma = false): unknown {
  const value = restoreCell((raw ?? '').trim());
  if (value === '') return undefined;
  if (!numericColumns.has(column)) return value;
  const written = decimalComma && decimalCommaNumber.test(value) ? value.replace(',', '.') : value;
  const number = Number(written);
  return Number.isFinite(number) ? number : value;
}
