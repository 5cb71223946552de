import { convertPotential, EngineError } from '@shared/engine';
import type { DisplayedPotential, RedoxPotentialRecord } from '@shared/schemas/library-measurements';
import type { UsedPotential } from '@shared/schemas/library-views';
import type { RedoxPotential } from '../../models';

/**
 * A stored potential converted into the lab's display reference by the engine, with the
 * constants used and the junction-potential warnings; the value as entered is never changed.
 * The potential's own solvent picks the Fc+/Fc or Ag/Ag+ constant.
 */
export function displayPotential(
  potential: Pick<RedoxPotential, 'value' | 'reference' | 'solvent'>,
  displayReference: string,
): { display: DisplayedPotential | null; displayProblem: string | null } {
  try {
    const converted = convertPotential({
      value: potential.value,
      from: potential.reference,
      to: displayReference,
      solvent: potential.solvent,
    });
    return {
      display: {
        value: converted.value,
        reference: converted.to,
        constants: converted.constants,
        warnings: converted.warnings,
      },
      displayProblem: null,
    };
  } catch (error) {
    if (error instanceof EngineError) return { display: null, displayProblem: error.message };
    throw error;
  }
}

export function toPotentialRecord(
  potential: RedoxPotential,
  displayReference: string,
  createdByName: string | null,
): RedoxPotentialRecord {
  return {
    id: potential.id,
    compoundId: potential.compoundId,
    couple: potential.couple,
    value: potential.value,
    reference: potential.reference,
    solvent: potential.solvent,
    electrolyte: potential.electrolyte ?? null,
    kind: potential.kind,
    source: potential.source ?? null,
    notes: potential.notes ?? '',
    createdById: potential.createdById ?? null,
    createdByName,
    version: potential.version,
    createdAt: potential.createdAt.toISOString(),
    updatedAt: potential.updatedAt.toISOString(),
    ...displayPotential(potential, displayReference),
  };
}

// Common practice: a reversible E1/2 is the best estimate of the formal potential; Ep/2 and
// Ep of irreversible waves come after it.
const kindRank = { 'half-wave': 0, 'half-peak': 1, peak: 2 } as const;

/**
 * The potential of one couple that computations use: convertible into the display reference,
 * the best kind of wave, then the most recently entered.
 */
export function pickPotential(
  potentials: RedoxPotential[],
  couple: 'oxidation' | 'reduction',
  displayReference: string,
): (UsedPotential & { warnings: string[] }) | null {
  const candidates = potentials
    .filter((potential) => potential.couple === couple)
    .map((potential) => ({ potential, ...displayPotential(potential, displayReference) }))
    .filter((candidate) => candidate.display !== null)
    .sort(
      (a, b) =>
        kindRank[a.potential.kind] - kindRank[b.potential.kind] ||
        b.potential.createdAt.getTime() - a.potential.createdAt.getTime(),
    );
  const best = candidates[0];
  if (!best?.display) return null;
  const { potential } = best;
  return {
    potentialId: potential.id,
    value: best.display.value,
    original: {
      value: potential.value,
      reference: potential.reference,
      solvent: potential.solvent,
      kind: potential.kind,
      source: potential.source ?? null,
    },
    warnings: best.display.warnings.map((warning) => warning.message),
  };
}
