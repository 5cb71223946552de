import { z } from 'zod';
import { solventSchema } from './library';
import { usedEnergySchema, usedPotentialSchema } from './library-views';

export const pathways = ['oxidative', 'reductive'] as const;
export const pathwaySchema = z.enum(pathways).meta({ id: 'QuenchingPathway' });

export const drivingForceQuerySchema = z.object({
  emitterId: z.string().uuid('must be a compound id'),
  quencherId: z.string().uuid('must be a compound id'),
  solvent: solventSchema.describe('Solvent of the study; its permittivity sets the Coulomb term'),
  pinned: pathwaySchema.optional().describe('The mechanism the user expects'),
  distance: z.coerce
    .number()
    .gt(0)
    .max(3e-9)
    .optional()
    .describe('Encounter distance for the Coulomb term, m (default 7e-10)'),
});

const pathwayResultSchema = z
  .object({
    electronvolts: z.number().describe('dG_ET without the Coulomb term, eV'),
    kilojoulesPerMole: z.number(),
    donorOxidation: z.number().describe('E(D+/D) used, V vs the reference'),
    acceptorReduction: z.number().describe('E(A/A-) used, V vs the reference'),
    e00: z.number().describe('eV'),
    workTerm: z.number().describe('Coulomb term w, eV, shown separately'),
    withWorkTerm: z.number().describe('dG_ET + w, eV'),
  })
  .meta({ id: 'PathwayDrivingForce' });

/** Exactly which number is missing for which compound, and what it blocks. */
export const missingInputSchema = z
  .object({
    compoundId: z.string().uuid(),
    compoundName: z.string(),
    quantity: z.enum(['oxidation', 'reduction', 'e00', 'tripletEnergy']),
    neededFor: z.array(z.enum(['oxidative', 'reductive', 'energy-transfer'])),
    message: z.string(),
  })
  .meta({ id: 'MissingInput' });

const partnerSchema = z.object({
  id: z.string().uuid(),
  name: z.string(),
  charge: z.number().int(),
  oxidation: usedPotentialSchema.nullable(),
  reduction: usedPotentialSchema.nullable(),
  tripletEnergy: z.number().nullable().describe('eV'),
});

export const drivingForceSchema = z
  .object({
    reference: z.string().describe('All potentials below are against this reference'),
    solvent: z.string(),
    emitter: partnerSchema.extend({ e00: usedEnergySchema.nullable() }),
    quencher: partnerSchema,
    oxidative: pathwayResultSchema.nullable().describe('Excited emitter gives an electron to the quencher'),
    reductive: pathwayResultSchema.nullable().describe('Quencher gives an electron to the excited emitter'),
    favoured: pathwaySchema.nullable().describe('The pathway with the more negative dG_ET'),
    highlighted: pathwaySchema.nullable().describe('The pinned pathway when computed, else the favoured one'),
    pinned: pathwaySchema.nullable(),
    coulomb: z.object({ permittivity: z.number(), distance: z.number().describe('m'), source: z.string() }),
    energyTransfer: z
      .object({
        possible: z.boolean(),
        energyDifference: z.number().describe('E_T(quencher) - E_T(emitter), eV'),
        kilojoulesPerMole: z.number(),
      })
      .nullable(),
    missing: z.array(missingInputSchema),
    warnings: z.array(z.string()),
  })
  .meta({ id: 'DrivingForce' });

export type Pathway = z.infer<typeof pathwaySchema>;
export type DrivingForceQuery = z.input<typeof drivingForceQuerySchema>;
export type DrivingForceResult = z.infer<typeof drivingForceSchema>;
export type MissingInput = z.infer<typeof missingInputSchema>;
