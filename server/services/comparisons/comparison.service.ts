import { ENGINE_VERSION, EngineError, fitRehmWeller, rehmWellerRateConstant } from '@shared/engine';
import type { Comparison, ComparisonRow, Trend } from '@shared/schemas/comparisons';
import { AppError } from '../../lib/app-error';
import type { LabContext } from '../../domain/lab-context';
import { Compound } from '../../models';
import { comparisonRows } from './comparison-rows';

/**
 * Rows fitted together: one solvent at one temperature with one k_diff (rows of a solvent of the
 * table at one temperature share it; an entered viscosity may set another).
 */
function trendGroups(rows: ComparisonRow[]): ComparisonRow[][] {
  const groups = new Map<string, ComparisonRow[]>();
  for (const row of rows) {
    const key = JSON.stringify([row.solvent, row.temperature, row.diffusionLimit?.value ?? null]);
    groups.set(key, [...(groups.get(key) ?? []), row]);
  }
  return [...groups.values()].sort(
    (a, b) => a[0]!.solvent.localeCompare(b[0]!.solvent) || a[0]!.temperature - b[0]!.temperature,
  );
}

/**
 * log10 kq against dG_ET for one solvent at one temperature, with the Rehm–Weller/Marcus fit of
 * lambda (engine fitRehmWeller) at that temperature, k_d = 8RT/(3 eta(T)) of the rows (engine
 * diffusionLimitFor, as each study's fit). Solvents and temperatures are never mixed in one fit.
 */
function trendFor(rows: ComparisonRow[], approvedOnly: boolean): Trend {
  const { solvent, temperature, diffusionLimit: limit } = rows[0]!;
  const usable = rows.filter((row) => row.kq && row.drivingForce && (!approvedOnly || row.status === 'approved'));
  const points = usable.map((row) => ({
    studyId: row.studyId,
    drivingForce: row.drivingForce!.electronvolts,
    log10Kq: Math.log10(row.kq!.value),
    approved: row.status === 'approved',
  }));
  const diffusionLimit = limit?.value ?? null;
  const entered = limit?.basis.startsWith('entered') ? ', entered viscosity' : '';
  const base = {
    solvent,
    temperature,
    label: `${solvent} at ${temperature} K${entered}`,
    diffusionLimit,
    diffusionBasis: limit?.basis ?? null,
    points,
  };
  if (diffusionLimit === null)
    return {
      ...base,
      fit: null,
      note: 'no diffusion limit: no viscosity for this solvent in the table, and none entered with the studies',
    };
  if (points.length < 3)
    return { ...base, fit: null, note: 'a trend needs at least 3 studies with kq and a driving force' };
  try {
    const fit = fitRehmWeller({
      drivingForces: points.map((point) => point.drivingForce),
      rateConstants: usable.map((row) => row.kq!.value),
      diffusionLimit,
      temperature,
    });
    const lambda = fit.reorganisationEnergy.value;
    const kdOverKZ = fit.kdOverKZ.value;
    const low = Math.min(...points.map((point) => point.drivingForce)) - 0.3;
    const high = Math.max(...points.map((point) => point.drivingForce)) + 0.3;
    const curve = Array.from({ length: 61 }, (_, i) => {
      const drivingForce = low + ((high - low) * i) / 60;
      return {
        drivingForce,
        log10Kq: Math.log10(
          rehmWellerRateConstant({ drivingForce, reorganisationEnergy: lambda, diffusionLimit, kdOverKZ, temperature }),
        ),
      };
    });
    return {
      ...base,
      fit: {
        reorganisationEnergy: lambda,
        reorganisationEnergyStandardError: fit.reorganisationEnergy.standardError,
        kdOverKZ,
        residualStandardDeviation: fit.residualStandardDeviation,
        n: fit.n,
        curve,
      },
      note: null,
    };
  } catch (error) {
    // the engine's reason without its field name ("rateConstants: "), which means nothing on the screen
    if (error instanceof EngineError)
      return { ...base, fit: null, note: error.message.replace(`${error.field}: `, '') };
    throw error;
  }
}

const sorters: Record<string, (a: ComparisonRow, b: ComparisonRow) => number> = {
  kq: (a, b) => (b.kq?.value ?? -1) - (a.kq?.value ?? -1),
  kSv: (a, b) => (b.kSv?.value ?? -1) - (a.kSv?.value ?? -1),
  drivingForce: (a, b) => (a.drivingForce?.electronvolts ?? 99) - (b.drivingForce?.electronvolts ?? 99),
  partner: (a, b) => a.partner.name.localeCompare(b.partner.name),
};

export async function compare(
  lab: LabContext,
  side: 'emitter' | 'quencher',
  compoundId: string,
  options: { approvedOnly: boolean; sort: string },
): Promise<Comparison> {
  const compound = await Compound.findOne({ where: { id: compoundId, labId: lab.id } });
  if (!compound) throw new AppError('not_found', 'No compound with this id in this lab.', 404);
  const rows = (await comparisonRows(lab, side, compoundId)).sort(sorters[options.sort] ?? sorters.kq);
  return {
    side,
    compound: { id: compound.id, name: compound.name },
    rows,
    trends: trendGroups(rows).map((group) => trendFor(group, options.approvedOnly)),
    engineVersion: ENGINE_VERSION,
  };
}
