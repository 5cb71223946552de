import { z } from 'zod';
import { REFERENCE_ELECTRODES, SOLVENTS } from '../engine';
import { compoundRoleHintSchema } from './compound-role';

/*
 * The compound library's records as the API sends and receives them. Units travel SI-coherent:
 * potentials in V, energies in eV, lifetimes in s, temperatures in K, wavelengths in nm.
 */

export const referenceElectrodeSchema = z
  .enum(REFERENCE_ELECTRODES as [string, ...string[]], {
    error: `must be a known reference electrode (${REFERENCE_ELECTRODES.join(', ')})`,
  })
  .meta({ id: 'ReferenceElectrode', description: 'Reference electrode of a potential (the engine’s list)' });

export const solventIds = Object.keys(SOLVENTS) as [string, ...string[]];
export const solventSchema = z
  .enum(solventIds, { error: 'must be a solvent of the solvent table' })
  .meta({ id: 'SolventId', description: 'Solvent id of the engine’s table, e.g. "acetonitrile"' });

/** The trade's own labels for the character of the emissive state. */
export const emissiveStates = [
  'MLCT',
  'LLCT',
  'ILCT',
  'LMCT',
  'LC',
  'pi,pi*',
  'n,pi*',
  'charge transfer',
  'mixed',
] as const;
export const emissiveStateSchema = z.enum(emissiveStates, { error: 'must be one of the listed state characters' });

const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, `must be at most ${max} characters`)
    .nullable()
    .optional()
    .transform((value) => (value === '' ? null : value));

export const compoundInputSchema = z
  .object({
    name: z.string().trim().min(1, 'must not be empty').max(160, 'must be at most 160 characters'),
    roleHint: compoundRoleHintSchema,
    smiles: optionalText(2000),
    formula: optionalText(120),
    notes: z.string().max(4000, 'must be at most 4000 characters').optional(),
    emissiveState: emissiveStateSchema.nullable().optional(),
    tripletEnergy: z
      .number({ error: 'must be a number in eV' })
      .gt(0, 'must be above 0 eV')
      .max(6, 'must be at most 6 eV')
      .nullable()
      .optional()
      .describe('Triplet energy E_T, eV'),
    tripletEnergySource: optionalText(400),
    charge: z
      .number({ error: 'must be a whole number' })
      .int('must be a whole number')
      .min(-6)
      .max(6)
      .optional()
      .describe('Charge number before electron transfer, for the Coulomb term (default 0)'),
  })
  .meta({ id: 'CompoundInput' });

export const compoundUpdateSchema = compoundInputSchema
  .partial()
  .extend({ version: z.number({ error: 'must be the version you read' }).int().min(0) })
  .meta({ id: 'CompoundUpdate' });

export const compoundSummarySchema = z
  .object({
    id: z.string().uuid(),
    name: z.string(),
    roleHint: compoundRoleHintSchema,
    smiles: z.string().nullable(),
    formula: z.string().nullable(),
    notes: z.string(),
    emissiveState: z.string().nullable(),
    tripletEnergy: z.number().nullable().describe('eV'),
    tripletEnergySource: z.string().nullable(),
    charge: z.number().int(),
    counts: z.object({ potentials: z.number().int(), lifetimes: z.number().int(), energies: z.number().int() }),
    createdById: z.string().uuid().nullable(),
    createdByName: z.string().nullable(),
    version: z.number().int(),
    createdAt: z.string(),
    updatedAt: z.string(),
  })
  .meta({ id: 'CompoundSummary' });

export const compoundListQuerySchema = z.object({
  search: z.string().trim().max(160).optional().describe('Part of the name, any case'),
  roleHint: compoundRoleHintSchema.optional().describe('photocatalyst or quencher also list compounds marked "both"'),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
});

export const compoundListSchema = z
  .object({
    items: z.array(compoundSummarySchema),
    total: z.number().int(),
    page: z.number().int(),
    pageSize: z.number().int(),
  })
  .meta({ id: 'CompoundList' });

export const compoundParamsSchema = z.object({
  labId: z.string().uuid('must be a lab id'),
  compoundId: z.string().uuid('must be a compound id'),
});
export const versionQuerySchema = z.object({
  version: z.coerce.number().int().min(0).optional().describe('The version you read; an older one gets 409'),
});

export type CompoundInput = z.input<typeof compoundInputSchema>;
export type CompoundUpdate = z.input<typeof compoundUpdateSchema>;
export type CompoundValues = z.output<typeof compoundInputSchema>;
export type CompoundChanges = z.output<typeof compoundUpdateSchema>;
export type CompoundSummary = z.infer<typeof compoundSummarySchema>;
export type CompoundList = z.infer<typeof compoundListSchema>;
export type CompoundListQuery = z.input<typeof compoundListQuerySchema>;
