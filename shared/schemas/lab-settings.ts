import { z } from 'zod';
import { referenceElectrodeSchema, solventSchema } from './library';

/** Admins choose the reference electrode and solvent in which the lab reads potentials (default SCE, acetonitrile). */
export const labSettingsUpdateSchema = z
  .object({ displayReference: referenceElectrodeSchema.optional(), displaySolvent: solventSchema.optional() })
  .refine((input) => input.displayReference !== undefined || input.displaySolvent !== undefined, {
    message: 'give a display reference or a display solvent',
    path: ['displayReference'],
  })
  .meta({ id: 'LabLibrarySettingsUpdate' });

export type LabSettingsUpdate = z.input<typeof labSettingsUpdateSchema>;
