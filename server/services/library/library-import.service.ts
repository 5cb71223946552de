import { parse } from 'csv-parse/sync';
import type { Sequelize } from 'sequelize';
import type { z } from 'zod';
import { e00FromWavelength } from '@shared/engine';
import { compoundInputSchema } from '@shared/schemas/library';
import type { CompoundValues } from '@shared/schemas/library';
import { libraryCsvColumns, libraryRecordKinds } from '@shared/schemas/library-import';
import type { ImportProblem, ImportReport, LibraryCsvColumn } from '@shared/schemas/library-import';
import { energyInputSchema, lifetimeInputSchema, potentialInputSchema } from '@shared/schemas/library-measurements';
import { AppError } from '../../lib/app-error';
import type { LabContext } from '../../domain/lab-context';
import { Compound } from '../../models';
import { recordLabAudit } from '../audit.service';
import type { Actor } from '../../domain/actor';
import { cellValue, csvDelimiter, fieldColumns } from './library-csv';
import { insertMeasurement } from './measurement-store.service';

type Kind = (typeof libraryRecordKinds)[number];
const schemas = {
  compound: compoundInputSchema,
  potential: potentialInputSchema,
  lifetime: lifetimeInputSchema,
  e00: energyInputSchema,
};
interface Planned {
  kind: Kind;
  compound: string;
  values: Record<string, unknown>;
}

function readRows(csv: string, delimiter: ',' | ';', problems: ImportProblem[]) {
  try {
    return parse(csv, {
      delimiter,
      columns: true,
      skip_empty_lines: true,
      relax_column_count: true,
      bom: true,
      info: true,
    }) as Array<{
      record: Record<string, string>;
      info: { lines: number };
    }>;
  } catch (error) {
    const line = (error as { lines?: number }).lines ?? 1;
    problems.push({ row: line, column: '', reason: `The file is not readable CSV: ${(error as Error).message}` });
    return [];
  }
}

/** Checks every row against the same schemas the forms use; nothing is written here. */
function planImport(csv: string, existing: Map<string, string>) {
  const problems: ImportProblem[] = [];
  const delimiter = csvDelimiter(csv);
  const rows = readRows(csv, delimiter, problems);
  const header = Object.keys(rows[0]?.record ?? {});
  for (const column of header) {
    if (!(libraryCsvColumns as readonly string[]).includes(column))
      problems.push({ row: 1, column, reason: 'is not a column of the library file' });
  }
  if (rows.length && (!header.includes('record') || !header.includes('compound'))) {
    problems.push({
      row: 1,
      column: 'record',
      reason: 'the header needs at least the columns "record" and "compound"',
    });
  }
  const inFile = new Set<string>();
  const planned: Planned[] = [];
  for (const { record, info } of rows) {
    const row = info.lines;
    const kind = record.record?.trim() as Kind;
    const compound = (record.compound ?? '').trim();
    if (!(libraryRecordKinds as readonly string[]).includes(kind)) {
      problems.push({ row, column: 'record', reason: `must be one of ${libraryRecordKinds.join(', ')}` });
      continue;
    }
    const map = fieldColumns[kind] as Record<string, LibraryCsvColumn>;
    const input = Object.fromEntries(
      Object.entries(map).map(([field, column]) => [field, cellValue(column, record[column], delimiter === ';')]),
    );
    const parsed = (schemas[kind] as z.ZodType).safeParse(input);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        problems.push({ row, column: map[String(issue.path[0])] ?? 'record', reason: issue.message });
      }
      continue;
    }
    const key = compound.toLowerCase();
    if (kind === 'compound') {
      if (existing.has(key) || inFile.has(key))
        problems.push({
          row,
          column: 'compound',
          reason: `"${compound}" is already in the library or earlier in the file`,
        });
      inFile.add(key);
    } else if (!compound) {
      problems.push({ row, column: 'compound', reason: 'must name the compound this record belongs to' });
    } else if (!existing.has(key) && !inFile.has(key)) {
      problems.push({
        row,
        column: 'compound',
        reason: `"${compound}" is neither in the library nor in an earlier row`,
      });
    }
    planned.push({ kind, compound: key, values: parsed.data as Record<string, unknown> });
  }
  if (rows.length === 0 && problems.length === 0)
    problems.push({ row: 1, column: '', reason: 'The file has no records under its header.' });
  return { problems, planned };
}

const countsOf = (planned: Planned[]) => ({
  compounds: planned.filter((item) => item.kind === 'compound').length,
  potentials: planned.filter((item) => item.kind === 'potential').length,
  lifetimes: planned.filter((item) => item.kind === 'lifetime').length,
  energies: planned.filter((item) => item.kind === 'e00').length,
});

/**
 * Imports a library CSV all or nothing: every row is checked first; with any problem nothing
 * is saved and each problem is reported by row and column; otherwise all rows go in one transaction.
 */
export async function importLibraryCsv(
  sequelize: Sequelize,
  lab: LabContext,
  actor: Actor,
  csv: string,
  dryRun: boolean,
): Promise<ImportReport> {
  const compounds = await Compound.findAll({ where: { labId: lab.id }, attributes: ['id', 'name'] });
  const ids = new Map(compounds.map((compound) => [compound.name.toLowerCase(), compound.id]));
  const names = new Map(compounds.map((compound) => [compound.name.toLowerCase(), compound.name]));
  const { problems, planned } = planImport(csv, ids);
  const counts = countsOf(planned);
  const [first] = problems;
  if (first && !dryRun) {
    throw new AppError(
      'import_invalid',
      `Nothing was saved: the file has ${problems.length} problem${problems.length === 1 ? '' : 's'}. ` +
        `First: row ${first.row}, column ${first.column || '(file)'}: ${first.reason}.`,
      400,
      problems.map((problem) => ({ path: `csv.row${problem.row}.${problem.column}`, message: problem.reason })),
    );
  }
  if (dryRun || problems.length) return { saved: false, counts, problems };
  await sequelize.transaction(async (transaction) => {
    for (const item of planned) {
      if (item.kind === 'compound') {
        const created = await Compound.create(
          { ...(item.values as CompoundValues), labId: lab.id, createdById: actor.userId },
          { transaction },
        );
        ids.set(item.compound, created.id);
        names.set(item.compound, created.name);
        await recordLabAudit({ lab, actor, transaction }, 'compound_added', ['compound', created.id], {
          import: true,
          ...item.values,
        });
        continue;
      }
      const compound = { id: ids.get(item.compound)!, name: names.get(item.compound) ?? item.compound };
      const wavelength = item.values.wavelength as number | undefined;
      const values =
        item.kind === 'e00' && wavelength !== undefined
          ? { ...item.values, value: e00FromWavelength(wavelength) }
          : item.values;
      const kind = item.kind === 'e00' ? 'energy' : item.kind;
      await insertMeasurement(lab, actor, kind, compound, values, transaction, { import: true });
    }
    await recordLabAudit({ lab, actor, transaction }, 'library_imported', ['lab', lab.id], counts);
  });
  return { saved: true, counts, problems: [] };
}
