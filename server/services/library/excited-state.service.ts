import { excitedStatePotentials } from '@shared/engine';
import type { ExcitedState, UsedEnergy } from '@shared/schemas/library-views';
import type { ExcitedStateEnergy, RedoxPotential } from '../../models';
import { pickPotential } from './display-potential.service';

/** The E00 computations use: the most recently entered one (the lab's latest judgement). */
export function pickEnergy(energies: ExcitedStateEnergy[]): UsedEnergy | null {
  const latest = [...energies].sort((a, b) => b.createdAt.getTime() - a.createdAt.getTime())[0];
  return latest
    ? { energyId: latest.id, value: latest.value, wavelength: latest.wavelength ?? null, method: latest.method }
    : null;
}

/**
 * E*(PC+/PC*) and E*(PC* / PC-) of an emitter by the engine's excitedStatePotentials, from the
 * chosen ground-state potentials in the display reference and the chosen E00; what is missing
 * is named instead of guessed.
 */
export function excitedStateOf(
  name: string,
  potentials: RedoxPotential[],
  energies: ExcitedStateEnergy[],
  displayReference: string,
): ExcitedState {
  const oxidation = pickPotential(potentials, 'oxidation', displayReference);
  const reduction = pickPotential(potentials, 'reduction', displayReference);
  const e00 = pickEnergy(energies);
  const missing: string[] = [];
  if (!oxidation)
    missing.push(`${name} has no ground-state oxidation potential E(PC+/PC) usable against ${displayReference}`);
  if (!reduction)
    missing.push(`${name} has no ground-state reduction potential E(PC/PC-) usable against ${displayReference}`);
  if (!e00) missing.push(`${name} has no E00`);
  const computed =
    e00 && (oxidation || reduction)
      ? excitedStatePotentials({ oxidation: oxidation?.value, reduction: reduction?.value, e00: e00.value })
      : { excitedOxidation: null, excitedReduction: null };
  const strip = <T extends { warnings: string[] }>(used: T | null) =>
    used ? (({ warnings: _, ...rest }) => rest)(used) : null;
  return {
    reference: displayReference,
    ...computed,
    oxidation: strip(oxidation),
    reduction: strip(reduction),
    e00,
    missing,
  };
}
