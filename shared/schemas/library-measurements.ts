import { z } from 'zod';
import { MAX_WAVELENGTH_NM, MIN_WAVELENGTH_NM } from '../engine';
import { referenceElectrodeSchema, solventSchema } from './library';

/*
 * Measurements kept per compound: ground-state potentials (V, as reported), excited-state
 * lifetimes (s) and E00 (eV, or a wavelength in nm that the engine converts).
 */

export const potentialCouples = ['oxidation', 'reduction'] as const;
/** half-wave: reversible E1/2; half-peak: Ep/2; peak: Ep of an irreversible wave */
export const potentialKinds = ['half-wave', 'half-peak', 'peak'] as const;
export const atmospheres = ['argon', 'nitrogen', 'air', 'oxygen', 'vacuum', 'other'] as const;

const text = (max: number) => z.string().trim().max(max, `must be at most ${max} characters`);
const optionalText = (max: number) =>
  text(max)
    .nullable()
    .optional()
    .transform((value) => (value === '' ? null : value));
const version = z.number({ error: 'must be the version you read' }).int().min(0);

const potentialFields = z.object({
  couple: z.enum(potentialCouples, { error: 'must be oxidation (M+/M) or reduction (M/M-)' }),
  value: z
    .number({ error: 'must be a number in volts' })
    .min(-5, 'must be at least -5 V')
    .max(5, 'must be at most 5 V')
    .describe('V against `reference`'),
  reference: referenceElectrodeSchema,
  solvent: solventSchema,
  electrolyte: optionalText(120),
  kind: z.enum(potentialKinds, { error: 'must be half-wave (E1/2), half-peak (Ep/2) or peak (Ep)' }),
  source: optionalText(400).describe('DOI or notebook reference'),
  notes: text(4000).optional(),
});
export const potentialInputSchema = potentialFields.meta({ id: 'RedoxPotentialInput' });
export const potentialUpdateSchema = potentialFields.partial().extend({ version }).meta({ id: 'RedoxPotentialUpdate' });

const lifetimeFields = z.object({
  value: z
    .number({ error: 'must be a number in seconds' })
    .gt(0, 'must be above 0 s')
    .max(1, 'must be at most 1 s')
    .describe('Unquenched lifetime, s'),
  uncertainty: z
    .number({ error: 'must be a number in seconds' })
    .min(0, 'must not be negative')
    .nullable()
    .optional()
    .describe('One standard uncertainty, s'),
  solvent: solventSchema,
  atmosphere: z.enum(atmospheres, { error: 'must be one of the listed atmospheres' }),
  temperature: z
    .number({ error: 'must be a number in kelvin' })
    .min(77, 'must be at least 77 K')
    .max(500, 'must be at most 500 K')
    .optional()
    .describe('K (default 298.15)'),
  method: text(120).min(1, 'must say how it was measured'),
  source: optionalText(400),
  notes: text(4000).optional(),
});
export const lifetimeInputSchema = lifetimeFields.meta({ id: 'LifetimeInput' });
export const lifetimeUpdateSchema = lifetimeFields.partial().extend({ version }).meta({ id: 'LifetimeUpdate' });

const wavelength = z
  .number({ error: 'must be a number in nm' })
  .min(MIN_WAVELENGTH_NM, `must be at least ${MIN_WAVELENGTH_NM} nm`)
  .max(MAX_WAVELENGTH_NM, `must be at most ${MAX_WAVELENGTH_NM} nm`);
const energyFields = z.object({
  value: z
    .number({ error: 'must be a number in eV' })
    .gt(0, 'must be above 0 eV')
    .max(6, 'must be at most 6 eV')
    .optional()
    .describe('E00, eV; give this or `wavelength`'),
  wavelength: wavelength.optional().describe('nm; E00 = 1239.84198 / wavelength (CODATA)'),
  method: text(120).min(1, 'must say how E00 was obtained'),
  source: optionalText(400),
  notes: text(4000).optional(),
});
const oneOf = (input: { value?: number; wavelength?: number }) =>
  (input.value === undefined) !== (input.wavelength === undefined);
const oneOfIssue = { message: 'give E00 either in eV or as a wavelength in nm, not both', path: ['value'] };
export const energyInputSchema = energyFields.refine(oneOf, oneOfIssue).meta({ id: 'ExcitedStateEnergyInput' });
export const energyUpdateSchema = energyFields
  .partial()
  .extend({ version })
  .refine((input) => input.value === undefined || input.wavelength === undefined, oneOfIssue)
  .meta({ id: 'ExcitedStateEnergyUpdate' });

const trail = {
  id: z.string().uuid(),
  compoundId: z.string().uuid(),
  source: z.string().nullable(),
  notes: z.string(),
  createdById: z.string().uuid().nullable(),
  createdByName: z.string().nullable(),
  version: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
};

export const potentialWarningSchema = z
  .object({ code: z.string(), message: z.string() })
  .meta({ id: 'PotentialWarning' });
export const displayedPotentialSchema = z
  .object({
    value: z.number().describe('V against `reference`'),
    reference: z.string(),
    constants: z.array(z.object({ reference: z.string(), value: z.number(), source: z.string() })),
    warnings: z.array(potentialWarningSchema),
  })
  .meta({ id: 'DisplayedPotential' });

export const potentialSchema = z
  .object({
    ...trail,
    couple: z.enum(potentialCouples),
    value: z.number().describe('V against `reference`, as entered'),
    reference: z.string(),
    solvent: z.string(),
    electrolyte: z.string().nullable(),
    kind: z.enum(potentialKinds),
    display: displayedPotentialSchema.nullable().describe('The same potential in the lab’s display reference'),
    displayProblem: z.string().nullable().describe('Why no display value could be computed'),
  })
  .meta({ id: 'RedoxPotential' });

export const lifetimeSchema = z
  .object({
    ...trail,
    value: z.number().describe('s'),
    uncertainty: z.number().nullable().describe('s'),
    solvent: z.string(),
    atmosphere: z.enum(atmospheres),
    temperature: z.number().describe('K'),
    method: z.string(),
  })
  .meta({ id: 'Lifetime' });

export const energySchema = z
  .object({
    ...trail,
    value: z.number().describe('eV'),
    wavelength: z.number().nullable().describe('nm'),
    method: z.string(),
  })
  .meta({ id: 'ExcitedStateEnergy' });

export const measurementParamsSchema = (idName: 'potentialId' | 'lifetimeId' | 'energyId') =>
  z.object({
    labId: z.string().uuid('must be a lab id'),
    compoundId: z.string().uuid('must be a compound id'),
    [idName]: z.string().uuid('must be a record id'),
  } as Record<'labId' | 'compoundId' | typeof idName, z.ZodString>);

export type PotentialInput = z.input<typeof potentialInputSchema>;
export type PotentialUpdate = z.input<typeof potentialUpdateSchema>;
export type LifetimeInput = z.input<typeof lifetimeInputSchema>;
export type LifetimeUpdate = z.input<typeof lifetimeUpdateSchema>;
export type EnergyInput = z.input<typeof energyInputSchema>;
export type EnergyUpdate = z.input<typeof energyUpdateSchema>;
export type PotentialValues = z.output<typeof potentialInputSchema>;
export type PotentialChanges = z.output<typeof potentialUpdateSchema>;
export type LifetimeValues = z.output<typeof lifetimeInputSchema>;
export type LifetimeChanges = z.output<typeof lifetimeUpdateSchema>;
export type EnergyValues = z.output<typeof energyInputSchema>;
export type EnergyChanges = z.output<typeof energyUpdateSchema>;
export type RedoxPotentialRecord = z.infer<typeof potentialSchema>;
export type LifetimeRecord = z.infer<typeof lifetimeSchema>;
export type EnergyRecord = z.infer<typeof energySchema>;
export type DisplayedPotential = z.infer<typeof displayedPotentialSchema>;
