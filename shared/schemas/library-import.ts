import { z } from 'zod';

/**
 * The library as one CSV file, one row per record. `record` says what the row is; measurement
 * rows name their compound, which must be in the lab or in an earlier row of the same file.
 * Units: potential_v in V against `reference`, lifetime_s and uncertainty_s in s, temperature_k
 * in K, e00_ev in eV or wavelength_nm in nm (not both), triplet_energy_ev in eV. On a compound
 * row `source` is where the triplet energy comes from.
 */
export const libraryCsvColumns = [
  'record',
  'compound',
  'role_hint',
  'smiles',
  'formula',
  'emissive_state',
  'triplet_energy_ev',
  'charge',
  'couple',
  'potential_v',
  'reference',
  'kind',
  'electrolyte',
  'solvent',
  'lifetime_s',
  'uncertainty_s',
  'atmosphere',
  'temperature_k',
  'e00_ev',
  'wavelength_nm',
  'method',
  'source',
  'notes',
] as const;
export type LibraryCsvColumn = (typeof libraryCsvColumns)[number];
export const libraryRecordKinds = ['compound', 'potential', 'lifetime', 'e00'] as const;

export const libraryImportSchema = z
  .object({
    csv: z
      .string()
      .min(1, 'must not be empty')
      .describe(
        'The file’s text, UTF-8, comma separated (or semicolon separated with decimal commas), header row first',
      ),
    dryRun: z.boolean().optional().describe('Only check the file and report; save nothing'),
  })
  .meta({ id: 'LibraryImport' });

export const importProblemSchema = z
  .object({
    row: z.number().int().describe('Line number in the file, header = 1'),
    column: z.string(),
    reason: z.string(),
  })
  .meta({ id: 'ImportProblem' });

export const importReportSchema = z
  .object({
    saved: z.boolean(),
    counts: z.object({
      compounds: z.number().int(),
      potentials: z.number().int(),
      lifetimes: z.number().int(),
      energies: z.number().int(),
    }),
    problems: z.array(importProblemSchema),
  })
  .meta({ id: 'LibraryImportReport' });

export type LibraryImportInput = z.input<typeof libraryImportSchema>;
export type ImportProblem = z.infer<typeof importProblemSchema>;
export type ImportReport = z.infer<typeof importReportSchema>;
