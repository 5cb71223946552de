import type { FitModel } from '../../schemas/studies';
import type { FitResult, PlotAxis } from '../../schemas/study-fits';
import { EngineError } from '../core/engine-error';
import type { QualityFlag } from '../flags/quality-flag';
import type { ParameterEstimate } from '../stats/parameter-estimate';
import { fixedLineBand, freeLineBand } from './bands';
import { diffusionLimitFor, kqIncludes, rateConstant, tau0For } from './kinetics';
import { lifetimeAnalysis } from './lifetimes';
import { lineStatistics } from './line-statistics';
import type { StudyFitOutcome, StudyFitPoint, StudyFitSettings } from './fit-study';

/** What the reported K_SV's standard error includes when only lifetimes are fitted. */
const INCLUDES = 'the scatter of τ0/τ about the line (lifetimes only, no intensity data)';

/**
 * The study fit of a series with lifetimes and no intensities (for instance one filled from a
 * decay set): the intensity fit is reported as "no intensity data", not as an error, and the
 * lifetime Stern–Volmer line tau0/tau = 1 + K_SV [Q] (Lakowicz, Principles of Fluorescence
 * Spectroscopy, 3rd ed., eq. 8.2; fitLifetimeSternVolmer) is the fit: its K_SV is the study's,
 * kq = K_SV/tau0 (and kq as the slope of 1/tau, as beside any intensity fit). Only a line
 * through the lifetimes is fitted: the combined static+dynamic and the modified models need
 * intensities, which a note says. The intercept is fixed at 1 for the fixed-line model, free
 * otherwise.
 *
 * @param entries - every point (left-out ones too) with its [Q] after the switched-on dilution correction, mol/L
 * @param axis - the [Q] axis of the plot
 * @param notes - the pipeline's notes, added to
 * @param flags - the pipeline's flags so far, added to
 * @throws EngineError TOO_FEW_POINTS when fewer than three included points carry a lifetime, or the lifetimes cannot be fitted (the reason in the message)
 * @example fitLifetimeOnly(settings, [0, 1e-3, 2e-3].map((q, i) => ({ point: { ...p, position: i, concentration: q, intensity: null, lifetime: 1e-6 / (1 + 500 * q) }, concentration: q })), 'linear-free', axis, [], []).kSv // 500
 */
export function fitLifetimeOnly(
  settings: StudyFitSettings,
  entries: ReadonlyArray<{ point: StudyFitPoint; concentration: number }>,
  model: FitModel,
  axis: PlotAxis,
  notes: string[],
  flags: QualityFlag[],
): StudyFitOutcome {
  const withLifetime = entries.filter((entry) => !entry.point.excluded && entry.point.lifetime !== null);
  const intercept = model === 'linear-fixed' ? 'fixed-at-one' : 'free';
  const lifetimeNotes: string[] = [];
  const lifetime = lifetimeAnalysis(
    withLifetime.map((entry) => ({ concentration: entry.concentration, lifetime: entry.point.lifetime })),
    settings.tau0,
    lifetimeNotes,
    intercept,
  );
  if (!lifetime)
    throw new EngineError(
      'TOO_FEW_POINTS',
      'lifetimes',
      `there are no intensities, and the lifetimes cannot be fitted either (${
        lifetimeNotes[0] ?? `${withLifetime.length} point(s) with a lifetime, at least 3 needed`
      })`,
      'Add intensities, or lifetimes at three or more concentrations',
    );
  notes.push(
    'No intensity data: K_SV and kq come from the lifetime Stern–Volmer fit, τ0/τ against [Q] (dynamic quenching only).',
    ...lifetimeNotes,
  );
  if (model === 'static-dynamic' || model === 'modified')
    notes.push(
      `The ${model === 'static-dynamic' ? 'combined static and dynamic' : 'modified'} model needs intensities; with lifetimes only, the line τ0/τ is fitted.`,
    );
  const chosen = settings.fitWeighting ?? 'unweighted';
  if (chosen === 'weighted') notes.push('A weighted fit was chosen, but the lifetime line is unweighted.');
  const { fit } = lifetime;
  const parameters: Record<string, ParameterEstimate> = { kSv: { ...fit.kSv, includes: INCLUDES } };
  if (fit.fittedIntercept) parameters.intercept = { ...fit.fittedIntercept, includes: INCLUDES };
  flags.push(...fit.flags);
  const tau0 = tau0For(settings, lifetime.tau0);
  const limit = diffusionLimitFor(settings, notes);
  let ratioToLimit: number | null = null;
  if (tau0) {
    const rate = rateConstant(parameters.kSv!, fit.degreesOfFreedom, tau0, limit);
    parameters.kq = { ...rate.kq, includes: kqIncludes(INCLUDES, tau0) };
    ratioToLimit = rate.ratio;
    flags.push(...rate.flags);
  }
  if (lifetime.kq)
    parameters.kqFromLifetimes = {
      ...lifetime.kq.kq,
      includes: 'kq is the slope of 1/τ against [Q], so τ0 does not enter; the scatter of 1/τ about that line',
    };
  const x = lifetime.points.map((point) => point.x);
  const y = lifetime.points.map((point) => point.y);
  const a = fit.fittedIntercept?.value ?? 1;
  const fitted = (xi: number) => a + fit.kSv.value * xi;
  const excluded = entries
    .filter((entry) => entry.point.excluded && entry.point.lifetime !== null)
    .map((entry) => ({
      position: entry.point.position,
      x: entry.concentration,
      y: lifetime.tau0.value / entry.point.lifetime!,
    }));
  const result: FitResult = {
    parameters,
    statistics: lineStatistics(fit),
    intensity: 'no-intensity-data',
    reference: { kind: 'lifetime-tau0', value: lifetime.tau0.value, source: 'τ0 of the lifetime fit, s' },
    replicates: null,
    weighting: {
      chosen,
      applied: 'unweighted',
      pointsWeighted: null,
      reason: chosen === 'weighted' ? 'the lifetime line is fitted unweighted' : null,
    },
    tau0,
    diffusionLimit: limit ? { ...limit, ratio: ratioToLimit } : null,
    lifetime: {
      kSv: fit.kSv,
      intercept,
      rSquared: fit.rSquared,
      verdict: null,
      points: lifetime.points,
      excluded,
      xAxis: axis,
    },
    flags: [...new Map(flags.map((flag) => [flag.code, flag])).values()],
    notes,
    corrections: null,
    plot: {
      xAxis: axis,
      yLabel: 'τ0/τ',
      points: lifetime.points.map((point, i) => ({
        ...point,
        position: withLifetime[i]!.point.position,
        residual: point.y - fitted(point.x),
      })),
      line: fit.fittedIntercept
        ? freeLineBand(x, y)
        : fixedLineBand(x, fit.kSv.value, fit.kSv.standardError, fit.degreesOfFreedom),
      excluded,
    },
  };
  return {
    model,
    kSv: fit.kSv.value,
    kq: parameters.kq?.value ?? null,
    result,
    // withLifetime and lifetime.points are in the same order: lifetimeAnalysis keeps every point it is given.
    pointsUsed: lifetime.points.map((point, i) => ({
      position: withLifetime[i]!.point.position,
      concentration: point.x,
      ratio: point.y,
    })),
  };
}
