import { quenchingFractions } from '@shared/engine';
import type { Scenario, ScenarioShare } from '@shared/schemas/scenarios';
import type { ReactionScenario } from '../../models';
import { kqCandidates, kqStandardError } from './kq-sources';

/**
 * Who intercepts the excited emitter at the reaction's concentrations (shared/engine/README.md, section 8): each
 * component's kq from the chosen study (or the best available one, approved first), then the
 * engine's competition fractions. A component without kq is named, and left out of the sums.
 */
export async function evaluateScenario(scenario: ReactionScenario, createdBy: string | null): Promise<Scenario> {
  const shares: ScenarioShare[] = [];
  for (const component of scenario.components ?? []) {
    const label = component.kind === 'oxygen' ? 'dissolved O2' : (component.compound?.name ?? 'unknown compound');
    const candidates =
      component.kind === 'compound' && component.compoundId
        ? await kqCandidates(scenario.labId, scenario.emitterId, component.compoundId, scenario.solvent)
        : [];
    const chosen = component.studyId
      ? candidates.find((candidate) => candidate.studyId === component.studyId)
      : candidates[0];
    let kq: number | null = null;
    let kqSource: ScenarioShare['kqSource'] = null;
    let kqError: number | null = null;
    if (chosen) {
      kq = chosen.kq;
      kqError = await kqStandardError(chosen.studyId);
      kqSource = {
        kind: 'study',
        studyId: chosen.studyId,
        title: chosen.title,
        status: chosen.status,
        solvent: chosen.solvent,
        chosen: component.studyId ? 'by-you' : 'best-available',
      };
    } else if (component.manualKq) {
      kq = component.manualKq;
      kqSource = { kind: 'manual', note: component.manualKqSource ?? '' };
    }
    shares.push({
      componentId: component.id,
      kind: component.kind,
      compoundId: component.compoundId,
      label,
      concentration: component.concentration,
      kq,
      kqStandardError: kqError,
      kqSource,
      candidates,
      pseudoFirstOrderRate: null,
      fraction: null,
    });
  }
  const known = shares.filter((share) => share.kq !== null);
  const fractions = quenchingFractions({
    tau0: scenario.tau0,
    components: known.map((share) => ({ id: share.componentId, kq: share.kq!, concentration: share.concentration })),
  });
  for (const result of fractions.components) {
    const share = shares.find((item) => item.componentId === result.id)!;
    share.fraction = result.fraction;
    share.pseudoFirstOrderRate = result.pseudoFirstOrderRate;
  }
  return {
    id: scenario.id,
    name: scenario.name,
    emitter: { id: scenario.emitterId, name: scenario.emitter?.name ?? '' },
    solvent: scenario.solvent,
    tau0: scenario.tau0,
    tau0Source: scenario.tau0Source,
    notes: scenario.notes,
    version: scenario.version,
    createdBy,
    updatedAt: scenario.updatedAt.toISOString(),
    shares,
    unquenched: fractions.unquenched,
    totalDecayRate: fractions.totalDecayRate,
    missing: shares
      .filter((share) => share.kq === null)
      .map((share) => ({ componentId: share.componentId, label: share.label, compoundId: share.compoundId })),
    caution: fractions.caution,
  };
}
