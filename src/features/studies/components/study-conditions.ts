import type { StudyFormOptions } from '@shared/schemas/studies';
import type { StudyFormValues } from './study-form-values';

/** The conditions a person keeps from one titration to the next (not the compounds, title or notes). */
const REMEMBERED = [
  'solventId',
  'temperature',
  'excitationWavelength',
  'emissionWavelength',
  'windowStart',
  'windowEnd',
  'atmosphere',
  'degassingMethod',
  'dataKind',
  'dilutionCorrection',
  'initialVolumeMilli',
  'stockMilli',
  'stockContainsEmitter',
  'innerFilterCorrection',
] as const satisfies ReadonlyArray<keyof StudyFormValues>;

const key = (userId: string, labId: string) => `halflight.study-conditions.${userId}.${labId}`;

/** The conditions this person used last in this lab (nothing when storage is off or empty). */
export function rememberedConditions(userId: string, labId: string): Partial<StudyFormValues> {
  try {
    const saved = JSON.parse(window.localStorage.getItem(key(userId, labId)) ?? '{}') as Record<string, unknown>;
    return Object.fromEntries(REMEMBERED.filter((name) => name in saved).map((name) => [name, saved[name]]));
  } catch {
    return {};
  }
}

/** Keeps the conditions of a study just made, for the person's next one in this lab. */
export function rememberConditions(userId: string, labId: string, values: StudyFormValues): void {
  try {
    window.localStorage.setItem(
      key(userId, labId),
      JSON.stringify(Object.fromEntries(REMEMBERED.map((name) => [name, values[name]]))),
    );
  } catch {
    // Without storage the defaults stay the product's own.
  }
}

/** The emitter's one lifetime record measured in the study's solvent, or null when none or several fit. */
export function fittingLifetime(options: StudyFormOptions, emitterId: string, solventId: string) {
  const solvent = options.solvents.find((s) => s.id === solventId);
  const fitting = options.lifetimes.filter(
    (l) =>
      l.compoundId === emitterId &&
      [solventId, solvent?.name].some((name) => name && name.toLowerCase() === l.solvent.toLowerCase()),
  );
  return fitting.length === 1 ? fitting[0]! : null;
}
