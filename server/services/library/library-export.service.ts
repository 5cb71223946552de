import { libraryCsvColumns } from '@shared/schemas/library-import';
import type { LibraryCsvColumn } from '@shared/schemas/library-import';
import type { LabContext } from '../../domain/lab-context';
import { Compound } from '../../models';
import type { ExcitedStateEnergy, ExcitedStateLifetime, RedoxPotential } from '../../models';
import { csvTable } from '../../lib/csv-cells';
import { fieldColumns } from './library-csv';
import { measurementsOf } from './measurement-store.service';

type Row = Partial<Record<LibraryCsvColumn, string | number | null>>;

function rowFrom(
  record: string,
  compound: string,
  map: Record<string, LibraryCsvColumn>,
  values: Record<string, unknown>,
): Row {
  const row: Row = { record, compound };
  for (const [field, column] of Object.entries(map)) {
    if (column === 'compound') continue;
    const value = values[field];
    if (value !== null && value !== undefined && value !== '') row[column] = value as string | number;
  }
  return row;
}

/** The whole library as CSV, one row per record, in the import format; formula-like cells neutralised. */
export async function exportLibraryCsv(lab: LabContext): Promise<string> {
  const compounds = await Compound.findAll({ where: { labId: lab.id }, order: [['name', 'ASC']] });
  const ids = compounds.map((compound) => compound.id);
  const potentials = await measurementsOf<RedoxPotential>('potential', lab.id, ids);
  const lifetimes = await measurementsOf<ExcitedStateLifetime>('lifetime', lab.id, ids);
  const energies = await measurementsOf<ExcitedStateEnergy>('energy', lab.id, ids);
  const rows: Row[] = [];
  for (const compound of compounds) {
    const plain = (row: { get(options: { plain: true }): object }) =>
      row.get({ plain: true }) as Record<string, unknown>;
    rows.push(rowFrom('compound', compound.name, fieldColumns.compound, plain(compound)));
    const mine = <T extends { compoundId: string }>(list: T[]) =>
      list.filter((item) => item.compoundId === compound.id);
    for (const potential of mine(potentials))
      rows.push(rowFrom('potential', compound.name, fieldColumns.potential, plain(potential)));
    for (const lifetime of mine(lifetimes))
      rows.push(rowFrom('lifetime', compound.name, fieldColumns.lifetime, plain(lifetime)));
    for (const energy of mine(energies)) {
      // E00 travels in eV only: an import row with both eV and nm is refused as ambiguous.
      const values = { ...plain(energy), wavelength: null };
      rows.push(rowFrom('e00', compound.name, fieldColumns.e00, values));
    }
  }
  return csvTable([libraryCsvColumns, ...rows.map((row) => libraryCsvColumns.map((column) => row[column] ?? ''))]);
}
