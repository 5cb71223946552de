import type { FitModel, FitWeighting } from '../../schemas/studies';
import type { FitResult, PlotAxis } from '../../schemas/study-fits';
import type { StudyPointValues } from '../../schemas/study-points';
import { CONCENTRATION_UNITS, concentrationDisplayUnit, unitLabel } from '../../units/units';
import { formatNumber } from '../../format';
import { EngineError } from '../core/engine-error';
import { qualityFlag, type QualityFlag } from '../flags/quality-flag';
import type { ParameterEstimate } from '../stats/parameter-estimate';
import { fitIntensitySternVolmer } from '../stern-volmer/fit-intensity-stern-volmer';
import { fitModifiedSternVolmer } from '../stern-volmer/fit-modified-stern-volmer';
import { fitStaticDynamic } from '../stern-volmer/fit-static-dynamic';
import { fitSternVolmer } from '../stern-volmer/fit-stern-volmer';
import { referenceFromBlanks } from '../stern-volmer/reference-from-blanks';
import { screenSeries } from '../stern-volmer/screen-series';
import { fixedLineBand, freeLineBand, quadraticBand, type BandPoint } from './bands';
import { correctPoint, type CorrectionSettings } from './corrections';
import { diffusionLimitFor, kqIncludes, rateConstant, tau0For, type KineticsSettings } from './kinetics';
import { fitLifetimeOnly } from './lifetime-only';
import { lifetimeAnalysis } from './lifetimes';
import { lineStatistics } from './line-statistics';
import { compareWeighting, poolReplicates, type PooledReplicates } from './replicates';

/** The study settings the pipeline reads (a study row or its plain settings). */
export interface StudyFitSettings extends KineticsSettings, CorrectionSettings {
  dataKind: 'intensity' | 'ratio';
  i0: number | null;
  /** 'weighted' fits the straight lines with weights 1/σ² of I0/I when the readings give them; default unweighted */
  fitWeighting?: FitWeighting;
}

type AppliedWeighting = NonNullable<FitResult['weighting']>['applied'];

/** A point as the pipeline reads it: its place in the series and its values (SI units). */
export type StudyFitPoint = Omit<StudyPointValues, 'exclusionReason'> & { position: number };

/** What the server stores: the model, the copied K_SV and kq, the full result and the points used. */
export interface StudyFitOutcome {
  model: FitModel;
  kSv: number | null;
  kq: number | null;
  result: FitResult;
  pointsUsed: Array<{ position: number; concentration: number; ratio: number }>;
}

/** A correction above 10 % dilution is worth a flag (common practice; shared/engine/README.md, section 4). */
const DILUTION_FLAG_FACTOR = 1.1;

/**
 * The concentration axis in the unit that shows the largest [Q] as 0.1 to 100 (shared/units), and
 * its reciprocal for the modified plot: 1/[Q] in M⁻¹ times the unit's factor is 1/[Q] in that unit⁻¹.
 */
function axesFor(largestConcentration: number): { concentration: PlotAxis; reciprocal: PlotAxis } {
  const unit = concentrationDisplayUnit(largestConcentration);
  const label = unitLabel(unit);
  const factor = CONCENTRATION_UNITS[unit];
  return {
    concentration: { label: `[Q] (${label})`, unit: label, scale: 1 / factor },
    reciprocal: { label: `1/[Q] (${label}⁻¹)`, unit: `${label}⁻¹`, scale: factor },
  };
}

/**
 * The runs, the per-concentration mean ± SD, and, when the readings give weights (their own σ or
 * the replicate scatter) and the model is a line, the weighted fit beside the unweighted one.
 */
function replicatesOf(
  pooled: PooledReplicates,
  model: FitModel,
  applied: AppliedWeighting,
  notes: string[],
): NonNullable<FitResult['replicates']> {
  let weighting: NonNullable<FitResult['replicates']>['weighting'] = null;
  if (pooled.weightSource && (model === 'linear-free' || model === 'linear-fixed')) {
    try {
      const comparison = compareWeighting(pooled, model === 'linear-free' ? 'free' : 'fixed-at-one');
      weighting = {
        source: pooled.weightSource,
        weighted: comparison.weighted.kSv,
        unweighted: comparison.unweighted.kSv,
        shift: comparison.shift,
        beyondStandardError: comparison.beyondStandardError,
        pointsWeighted: comparison.pointsWeighted,
      };
      if (comparison.beyondStandardError)
        notes.push(
          `Weighting by ${pooled.weightSource === 'point-uncertainties' ? 'the readings’ uncertainties' : 'the replicate scatter'} moves K_SV by ${formatNumber(comparison.shift)} M⁻¹, more than its standard error (${formatNumber(comparison.unweighted.kSv.standardError)} M⁻¹); the reported K_SV is the ${applied === 'unweighted' ? 'unweighted' : 'weighted'} one.`,
        );
    } catch (error) {
      if (!(error instanceof EngineError)) throw error;
      notes.push(`No weighted fit: ${error.message}`);
    }
  }
  return { runs: pooled.i0, summary: pooled.summary, weighting };
}

/**
 * The study-fit pipeline, from the study's points, settings and tau0 source to the result the
 * server stores: each point corrected once (dilution, inner filter), excluded points dropped from
 * the fit, the chosen model fitted (free or fixed line, combined static+dynamic, modified, with the
 * lifetime series beside), kq with the diffusion limit at the study's temperature, every flag, and
 * the plot series with their axis titles and units and the left-out points at their plotted places.
 * Pure: no database, same answer on server and client. Throws EngineError when the series cannot be
 * fitted.
 */
export function fitStudy(
  settings: StudyFitSettings,
  points: readonly StudyFitPoint[],
  model: FitModel,
): StudyFitOutcome {
  const isRatio = settings.dataKind === 'ratio';
  const notes: string[] = [];
  const flags: QualityFlag[] = [];
  // Corrections once per point; the fit, the lifetimes and the left-out markers all read these.
  const corrected = points.map((point) => {
    const values = correctPoint(settings, point, isRatio);
    return {
      point,
      concentration: values?.concentration ?? point.concentration,
      value: values ? values.intensity : point.intensity,
      dilutionFactor: values?.dilutionFactor ?? null,
      innerFilterFactor: values?.innerFilterFactor ?? null,
      corrected: values !== null,
      missing: values?.missing ?? [],
    };
  });
  const included = corrected.filter((entry) => !entry.point.excluded);
  const used = included.flatMap((entry) => {
    if (entry.value === null) return [];
    const { point } = entry;
    if (entry.missing.length)
      notes.push(`Point ${point.position + 1}: no ${entry.missing.join(' and no ')}; used as measured.`);
    if (entry.dilutionFactor && entry.dilutionFactor > DILUTION_FLAG_FACTOR)
      flags.push(
        qualityFlag(
          'LARGE_DILUTION',
          `dilution factor ${entry.dilutionFactor.toFixed(3)} at point ${point.position + 1}`,
        ),
      );
    return [{ point, concentration: entry.concentration, value: entry.value }];
  });
  // Every point's corrected values (left-out ones too), kept so a read never corrects again.
  const corrections = corrected.some((entry) => entry.corrected)
    ? corrected.map((entry) => ({
        position: entry.point.position,
        concentration: entry.concentration,
        intensity: entry.value,
        dilutionFactor: entry.dilutionFactor,
        innerFilterFactor: entry.innerFilterFactor,
      }))
    : null;
  // Lifetimes and no intensity at all: the lifetime line is the fit, the intensity fit "no intensity data".
  if (!isRatio && used.length === 0 && included.some((entry) => entry.point.lifetime !== null)) {
    const axis = axesFor(Math.max(0, ...corrected.map((entry) => entry.concentration))).concentration;
    const outcome = fitLifetimeOnly(settings, corrected, model, axis, notes, flags);
    return { ...outcome, result: { ...outcome.result, corrections } };
  }
  const leftOut = corrected.filter((entry) => entry.point.excluded && entry.value !== null);
  const x = used.map((entry) => entry.concentration);
  const values = used.map((entry) => entry.value);
  const everyUncertainty = used.length > 0 && used.every((entry) => entry.point.uncertainty !== null);

  const screen = isRatio
    ? null
    : screenSeries({
        concentrations: x,
        intensities: values,
        ...(settings.i0 !== null ? { i0: settings.i0 } : {}),
        ...(settings.innerFilterCorrection
          ? {}
          : {
              absorbancesExcitation: used.map((entry) => entry.point.absorbanceExcitation ?? 0),
              absorbancesEmission: used.map((entry) => entry.point.absorbanceEmission ?? 0),
              innerFilterCorrection: false,
            }),
      });
  flags.push(...(screen?.flags.filter((flag) => flag.severity === 'warning') ?? []));
  // Replicate runs (more than one series): each normalised by its own I0, then fitted as ratios.
  const runs = new Set(used.map((entry) => entry.point.series));
  const pooled =
    !isRatio && runs.size > 1
      ? poolReplicates(
          used.map((entry) => ({
            series: entry.point.series,
            concentration: entry.concentration,
            intensity: entry.value,
            uncertainty: entry.point.uncertainty,
          })),
          settings.i0 !== null ? { i0: settings.i0 } : undefined,
        )
      : null;
  const asRatios = isRatio || pooled !== null;
  const lineModel = model === 'linear-free' || model === 'linear-fixed';
  const chosen = settings.fitWeighting ?? 'unweighted';
  let applied: AppliedWeighting = 'unweighted';
  let unweightedBecause: string | null = null;
  if (chosen === 'weighted') {
    if (!lineModel) unweightedBecause = 'weights apply to the straight-line models only';
    else if (pooled?.weightSource) applied = pooled.weightSource;
    else if (pooled)
      unweightedBecause = 'not every reading has an uncertainty, nor every concentration two differing replicates';
    else if (everyUncertainty) applied = 'point-uncertainties';
    else unweightedBecause = 'not every point has an uncertainty, and a single run has no replicate scatter';
    if (unweightedBecause) notes.push(`A weighted fit was chosen, but this one is unweighted: ${unweightedBecause}.`);
  } else if (lineModel && everyUncertainty && !pooled)
    notes.push('Every point has an uncertainty: choose the weighted fit to weigh them by 1/σ².');
  // The readings' own σ, when the single-run fit is weighted by them.
  const sigmas =
    applied === 'point-uncertainties' && !pooled ? used.map((entry) => entry.point.uncertainty!) : undefined;
  const i0 = isRatio
    ? { value: 1, source: 'ratios entered as I0/I', replicates: 0 }
    : pooled
      ? { value: 1, source: `each of ${pooled.i0.length} runs by its own I0`, replicates: 0 }
      : (() => {
          const reference = referenceFromBlanks(x, values, settings.i0 ?? undefined, {
            field: 'i0',
            code: 'MISSING_I0',
          });
          return {
            value: reference.value,
            source:
              reference.source === 'given' ? 'entered with the study' : `mean of ${reference.replicates} blank(s)`,
            replicates: reference.source === 'given' ? 0 : reference.replicates,
          };
        })();
  // What the SE of a constant fitted to I0/I includes: only the straight-line fits widen it by
  // I0's own uncertainty (withReferenceUncertainty, from two blanks or more).
  const scatter =
    applied === 'point-uncertainties'
      ? "the points' own uncertainties"
      : applied === 'replicate-scatter'
        ? 'the replicate scatter at each [Q]'
        : 'the scatter of the points';
  const lineIncludes = isRatio
    ? `${scatter} (ratios entered)`
    : pooled
      ? `${scatter}; each of ${pooled.i0.length} runs divided by its own I0, taken as exact`
      : settings.i0 !== null
        ? `${scatter}; I0 entered, taken as exact`
        : i0.replicates >= 2
          ? `${scatter} and I0 from ${i0.replicates} blanks`
          : `${scatter}; I0 from a single blank, without uncertainty`;
  const otherIncludes =
    isRatio || pooled || settings.i0 !== null
      ? lineIncludes
      : i0.replicates >= 2
        ? `${scatter}; I0 from ${i0.replicates} blanks, taken as exact in this model`
        : `${scatter}; I0 from a single blank, without uncertainty`;
  const including = (estimate: ParameterEstimate, includes: string): ParameterEstimate => ({ ...estimate, includes });
  const ratios = isRatio
    ? values
    : pooled
      ? pooled.ratios.map((entry) => entry.ratio)
      : values.map((value) => i0.value / value);
  // σ of each I0/I when the fit is weighted; null for a pooled blank without one (left out of the fit).
  const sigmaRatios: Array<number | null> | undefined = pooled
    ? applied !== 'unweighted'
      ? pooled.ratios.map((entry) => (entry.sigma !== null && entry.sigma > 0 ? entry.sigma : null))
      : undefined
    : sigmas && (isRatio ? sigmas : sigmas.map((sigma, i) => (ratios[i]! * sigma) / values[i]!));
  // The points the straight line is fitted to: all of them, or those with a σ when pooled runs are weighted.
  const lineIndex = used.flatMap((_, i) => (sigmaRatios && sigmaRatios[i] === null ? [] : [i]));
  if (lineIndex.length < used.length)
    notes.push(
      `${used.length - lineIndex.length} blank(s) without an uncertainty of their own (each sets its run's I0) are left out of the weighted fit.`,
    );
  const lineX = lineIndex.map((i) => x[i]!);
  const lineRatios = lineIndex.map((i) => ratios[i]!);
  const lineSigmas = sigmaRatios && lineIndex.map((i) => sigmaRatios[i]!);
  // What the models fit: ratios when the study holds ratios or pools runs, else the intensities.
  const fitValues = pooled ? ratios : values;
  const runI0 = new Map(pooled?.i0.map((run) => [run.series, run.value]));
  /** I0/I of a (left-out) reading: entered, or with its run's I0, or with the study's I0; null when its run has none. */
  const ratioOf = (entry: { point: StudyFitPoint; value: number | null }) =>
    isRatio
      ? entry.value!
      : pooled
        ? runI0.has(entry.point.series)
          ? runI0.get(entry.point.series)! / entry.value!
          : null
        : i0.value / entry.value!;

  // Lifetimes need no intensity correction, but their [Q] is diluted like the intensities' (shared/engine/README.md, section 4).
  const lifetimeSeries = included.map((entry) => ({
    concentration: entry.concentration,
    lifetime: entry.point.lifetime,
  }));
  const axes = axesFor(Math.max(0, ...corrected.map((entry) => entry.concentration)));
  // Like with like: with the intensity line fixed through 1, the lifetime line is fixed too.
  const lifetime = lifetimeAnalysis(
    lifetimeSeries,
    settings.tau0,
    notes,
    model === 'linear-fixed' ? 'fixed-at-one' : 'free',
  );
  const tau0 = tau0For(settings, lifetime?.tau0 ?? null);
  const limit = diffusionLimitFor(settings, notes);
  const parameters: Record<string, ParameterEstimate> = {};
  let band: BandPoint[];
  let fitted: (xi: number) => number;
  let statistics: FitResult['statistics'];
  let kForRate: ParameterEstimate | null = null;
  let yLabel = 'I0/I';
  let xAxis = axes.concentration;
  let plotX = x;
  let plotY = ratios;
  let plotPositions = used.map((entry) => entry.point.position);
  // Left-out points on the same axes as the fitted ones: I0/I from the corrected value.
  let excluded = leftOut.flatMap((entry) => {
    const y = ratioOf(entry);
    return y === null ? [] : [{ position: entry.point.position, x: entry.concentration, y }];
  });

  if (model === 'linear-free' || model === 'linear-fixed') {
    const intercept = model === 'linear-free' ? 'free' : 'fixed-at-one';
    const fit = asRatios
      ? fitSternVolmer({
          concentrations: lineX,
          ratios: lineRatios,
          ...(lineSigmas ? { ratioUncertainties: lineSigmas } : {}),
          intercept,
        })
      : fitIntensitySternVolmer({
          concentrations: x,
          intensities: values,
          ...(sigmas ? { intensityUncertainties: sigmas } : {}),
          ...(settings.i0 !== null ? { i0: settings.i0 } : {}),
          intercept,
        });
    parameters.kSv = including(fit.kSv, lineIncludes);
    if (fit.fittedIntercept) parameters.intercept = including(fit.fittedIntercept, lineIncludes);
    flags.push(...fit.flags);
    kForRate = parameters.kSv;
    const a = fit.fittedIntercept?.value ?? 1;
    fitted = (xi) => a + fit.kSv.value * xi;
    band = fit.fittedIntercept
      ? freeLineBand(
          lineX,
          lineRatios,
          lineSigmas?.map((s) => 1 / (s * s)),
        )
      : fixedLineBand(x, fit.kSv.value, fit.kSv.standardError, fit.degreesOfFreedom);
    statistics = lineStatistics(fit);
    if (lifetime) flags.push(...lifetime.compare(fit));
  } else if (model === 'static-dynamic') {
    const maxDynamic = limit && tau0 ? limit.value * tau0.value : undefined;
    const fit = fitStaticDynamic({
      concentrations: x,
      ratios,
      ...(lifetime ? { lifetimeSlope: lifetime.fit.kSv.value } : {}),
      ...(maxDynamic ? { maxDynamicConstant: maxDynamic } : {}),
    });
    Object.assign(parameters, {
      sum: including(fit.sum, otherIncludes),
      product: including(fit.product, otherIncludes),
      largerRoot: including(fit.largerRoot, otherIncludes),
      smallerRoot: including(fit.smallerRoot, otherIncludes),
    });
    if (fit.assignment.kind === 'resolved') {
      const kD = including(fit.assignment.kD, otherIncludes);
      Object.assign(parameters, { kD, kS: including(fit.assignment.kS, otherIncludes) });
      kForRate = kD;
    } else notes.push(fit.assignment.rule);
    fitted = (xi) => 1 + fit.sum.value * xi + fit.product.value * xi * xi;
    band = quadraticBand(x, ratios);
    statistics = {
      n: fit.n,
      degreesOfFreedom: fit.degreesOfFreedom,
      rSquared: null,
      residualStandardDeviation: fit.residualStandardDeviation,
      curvature: null,
      curvaturePValue: null,
    };
  } else {
    const fit = fitModifiedSternVolmer({
      concentrations: x,
      intensities: asRatios ? ratios.map((r) => 1 / r) : values,
      ...(asRatios ? { i0: 1 } : settings.i0 !== null ? { i0: settings.i0 } : {}),
    });
    Object.assign(parameters, {
      kSv: including(fit.kSv, otherIncludes),
      accessibleFraction: including(fit.accessibleFraction, otherIncludes),
    });
    kForRate = parameters.kSv!;
    const quenched = used.flatMap((entry, i) => (entry.concentration > 0 ? [i] : []));
    // I0/(I0 − I), or from a ratio r = I0/I: 1/(1 − 1/r) (Lehrer 1971).
    const modifiedY = (value: number) => (asRatios ? 1 / (1 - 1 / value) : fit.i0.value / (fit.i0.value - value));
    plotX = quenched.map((i) => 1 / x[i]!);
    plotY = quenched.map((i) => modifiedY(fitValues[i]!));
    plotPositions = quenched.map((i) => used[i]!.point.position);
    excluded = leftOut.flatMap((entry) => {
      const ratio = pooled ? ratioOf(entry) : entry.value;
      return entry.concentration > 0 && ratio !== null
        ? [{ position: entry.point.position, x: 1 / entry.concentration, y: modifiedY(ratio) }]
        : [];
    });
    fitted = (xi) => fit.line.intercept.value + fit.line.slope.value * xi;
    band = freeLineBand(plotX, plotY, undefined, Math.min(...plotX));
    yLabel = 'I0/(I0 − I)';
    xAxis = axes.reciprocal;
    statistics = {
      n: fit.n,
      degreesOfFreedom: fit.degreesOfFreedom,
      rSquared: fit.line.rSquared,
      rSquaredDefinition: 'centred',
      rSquaredCentred: fit.line.rSquared,
      residualStandardDeviation: null,
      curvature: null,
      curvaturePValue: null,
    };
  }

  let ratioToLimit: number | null = null;
  if (kForRate && tau0) {
    const rate = rateConstant(kForRate, statistics.degreesOfFreedom, tau0, limit);
    parameters.kq = including(rate.kq, kqIncludes(kForRate.includes ?? scatter, tau0));
    ratioToLimit = rate.ratio;
    flags.push(...rate.flags);
  } else if (!tau0) notes.push('Enter tau0 (or add lifetimes with a blank) to turn K_SV into kq.');
  // kq from the lifetimes alone: the slope of 1/τ against [Q], so τ0 (the intercept) is not counted twice.
  if (lifetime?.kq)
    parameters.kqFromLifetimes = including(
      lifetime.kq.kq,
      'kq is the slope of 1/τ against [Q], so τ0 does not enter; the scatter of 1/τ about that line',
    );

  const unique = [...new Map(flags.map((flag) => [flag.code, flag])).values()];
  return {
    model,
    kSv: parameters.kSv?.value ?? parameters.kD?.value ?? null,
    kq: parameters.kq?.value ?? null,
    pointsUsed: used.map((entry, i) => ({ position: entry.point.position, concentration: x[i]!, ratio: ratios[i]! })),
    result: {
      parameters,
      statistics,
      intensity: 'fitted',
      reference: {
        kind: isRatio ? 'ratio-data' : pooled ? 'replicate-runs' : 'i0',
        value: i0.value,
        source: i0.source,
      },
      replicates: pooled && replicatesOf(pooled, model, applied, notes),
      weighting: {
        chosen,
        applied,
        pointsWeighted: applied === 'unweighted' ? null : statistics.n,
        reason: unweightedBecause,
      },
      tau0,
      diffusionLimit: limit ? { ...limit, ratio: ratioToLimit } : null,
      lifetime: lifetime
        ? {
            kSv: lifetime.fit.kSv,
            intercept: lifetime.intercept,
            rSquared: lifetime.fit.rSquared,
            verdict: lifetime.verdict,
            points: lifetime.points,
            // left-out lifetimes at their plotted place: τ0/τ with the fitted τ0, [Q] corrected
            excluded: corrected
              .filter((entry) => entry.point.excluded && entry.point.lifetime !== null)
              .map((entry) => ({
                position: entry.point.position,
                x: entry.concentration,
                y: lifetime.tau0.value / entry.point.lifetime!,
              })),
            xAxis: axes.concentration,
          }
        : null,
      flags: unique,
      notes,
      corrections,
      plot: {
        xAxis,
        yLabel,
        points: plotX.map((xi, i) => ({
          x: xi,
          y: plotY[i]!,
          position: plotPositions[i]!,
          residual: plotY[i]! - fitted(xi),
        })),
        line: band,
        excluded,
      },
    },
  };
}
