import { z } from 'zod';
import { compoundSummarySchema } from './library';
import { energySchema, lifetimeSchema, potentialSchema } from './library-measurements';
import { fitModelSchema } from './studies';

/** One ground-state potential chosen for a computation, in the display reference, with where it came from. */
export const usedPotentialSchema = z
  .object({
    potentialId: z.string().uuid(),
    value: z.number().describe('V against the display reference'),
    original: z.object({
      value: z.number(),
      reference: z.string(),
      solvent: z.string(),
      kind: z.string(),
      source: z.string().nullable(),
    }),
  })
  .meta({ id: 'UsedPotential' });
export type UsedPotential = z.infer<typeof usedPotentialSchema>;

export const usedEnergySchema = z
  .object({
    energyId: z.string().uuid(),
    value: z.number().describe('eV'),
    wavelength: z.number().nullable(),
    method: z.string(),
  })
  .meta({ id: 'UsedEnergy' });
export type UsedEnergy = z.infer<typeof usedEnergySchema>;

/** E*(PC+/PC*) = E(PC+/PC) - E00 and E*(PC* / PC-) = E(PC/PC-) + E00, from the inputs listed beside them. */
export const excitedStateSchema = z
  .object({
    reference: z.string(),
    excitedOxidation: z.number().nullable().describe('E*(PC+/PC*), V'),
    excitedReduction: z.number().nullable().describe('E*(PC* / PC-), V'),
    oxidation: usedPotentialSchema.nullable(),
    reduction: usedPotentialSchema.nullable(),
    e00: usedEnergySchema.nullable(),
    missing: z.array(z.string()).describe('What is needed and not yet in the library'),
  })
  .meta({ id: 'ExcitedStatePotentials' });
export type ExcitedState = z.infer<typeof excitedStateSchema>;

export const compoundDetailSchema = compoundSummarySchema
  .extend({
    displayReference: z.string(),
    potentials: z.array(potentialSchema),
    lifetimes: z.array(lifetimeSchema),
    energies: z.array(energySchema),
    excitedState: excitedStateSchema,
  })
  .meta({ id: 'CompoundDetail' });
export type CompoundDetail = z.infer<typeof compoundDetailSchema>;

export const labSettingsSchema = z
  .object({ displayReference: z.string(), displaySolvent: z.string() })
  .meta({ id: 'LabLibrarySettings', description: 'Reference electrode and solvent in which the lab reads potentials' });
export type LabSettings = z.infer<typeof labSettingsSchema>;

/** A study whose tau0 comes from a lifetime record; it is refitted only when someone chooses to. */
export const lifetimeDependentSchema = z
  .object({
    studyId: z.string().uuid(),
    title: z.string(),
    status: z.string(),
    tau0: z.number().nullable().describe('s, as the study holds it now'),
    tau0Uncertainty: z.number().nullable().describe('s, as the study holds it now'),
    matchesRecord: z.boolean().describe('False when the record changed after the study took its tau0'),
    fitModel: fitModelSchema.describe("the study's current model, for a refit"),
    version: z.number().int().describe('send it with PATCH /studies/:studyId'),
    ownerId: z.string().uuid().nullable().describe('only the owner refits a study'),
    ownerName: z.string().nullable(),
    updatedAt: z.string(),
  })
  .meta({ id: 'LifetimeDependent' });
export type LifetimeDependent = z.infer<typeof lifetimeDependentSchema>;
export const lifetimeDependentsSchema = z
  .object({
    lifetimeId: z.string().uuid(),
    value: z.number().describe('s'),
    uncertainty: z.number().nullable().describe('s'),
    studies: z.array(lifetimeDependentSchema),
  })
  .meta({ id: 'LifetimeDependents' });
export type LifetimeDependents = z.infer<typeof lifetimeDependentsSchema>;
