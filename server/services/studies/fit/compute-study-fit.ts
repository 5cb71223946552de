import {
  fitIntensitySternVolmer,
  fitModifiedSternVolmer,
  fitStaticDynamic,
  fitSternVolmer,
  qualityFlag,
  referenceFromBlanks,
  screenSeries,
  type ParameterEstimate,
  type QualityFlag,
} from '@shared/engine';
import type { FitModel } from '@shared/schemas/studies';
import type { FitResult } from '@shared/schemas/study-fits';
import { fixedLineBand, freeLineBand, quadraticBand, type BandPoint } from './fit-plot';
import { diffusionLimitFor, rateConstant, tau0For, type KineticsSettings } from './kq-and-limit';
import { lifetimeAnalysis } from './lifetime-analysis';
import { correctPoint, type CorrectablePoint, type CorrectionSettings } from './series-corrections';

export interface FitSettings extends KineticsSettings, CorrectionSettings {
  dataKind: 'intensity' | 'ratio';
  i0: number | null;
}

export interface SeriesPoint extends CorrectablePoint {
  position: number;
  lifetime: number | null;
  uncertainty: number | null;
  excluded: boolean;
}

export interface ComputedFit {
  model: FitModel;
  kSv: number | null;
  kq: number | null;
  result: FitResult;
  pointsUsed: Array<{ position: number; concentration: number; ratio: number }>;
}

/** A correction above 10 % dilution is worth a flag (common practice; shared/engine/README.md, section 9). */
const DILUTION_FLAG_FACTOR = 1.1;

/**
 * Study points -> engine: drops excluded points, applies the switched-on corrections, fits the
 * chosen model, adds the lifetime series, kq with the diffusion limit, and every flag.
 * Throws the engine's EngineError when the series cannot be fitted.
 */
export function computeStudyFit(settings: FitSettings, points: readonly SeriesPoint[], model: FitModel): ComputedFit {
  const isRatio = settings.dataKind === 'ratio';
  const included = points.filter((point) => !point.excluded);
  const notes: string[] = [];
  const flags: QualityFlag[] = [];
  const used = included
    .filter((point) => point.intensity !== null)
    .map((point) => {
      const corrected = correctPoint(settings, point, isRatio);
      if (corrected?.missing.length)
        notes.push(`Point ${point.position + 1}: no ${corrected.missing.join(' and no ')}; used as measured.`);
      if (corrected?.dilutionFactor && corrected.dilutionFactor > DILUTION_FLAG_FACTOR)
        flags.push(
          qualityFlag(
            'LARGE_DILUTION',
            `dilution factor ${corrected.dilutionFactor.toFixed(3)} at point ${point.position + 1}`,
          ),
        );
      return {
        point,
        concentration: corrected?.concentration ?? point.concentration,
        value: corrected?.intensity ?? point.intensity!,
      };
    });
  const x = used.map((entry) => entry.concentration);
  const values = used.map((entry) => entry.value);
  const everyUncertainty = used.length > 0 && used.every((entry) => entry.point.uncertainty !== null);
  const sigmas = everyUncertainty ? used.map((entry) => entry.point.uncertainty!) : undefined;
  if (!everyUncertainty && used.some((entry) => entry.point.uncertainty !== null))
    notes.push('Only some points have an uncertainty, so the fit is unweighted.');

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
            }),
      });
  flags.push(...(screen?.flags.filter((flag) => flag.severity === 'warning') ?? []));
  const i0 = isRatio
    ? { value: 1, source: 'ratios entered as I0/I' }
    : (() => {
        const reference = referenceFromBlanks(x, values, settings.i0 ?? undefined, { field: 'i0', code: 'MISSING_I0' });
        return {
          value: reference.value,
          source: reference.source === 'given' ? 'entered with the study' : `mean of ${reference.replicates} blank(s)`,
        };
      })();
  const ratios = isRatio ? values : values.map((value) => i0.value / value);
  const sigmaRatios = sigmas && (isRatio ? sigmas : sigmas.map((sigma, i) => (ratios[i]! * sigma) / values[i]!));

  // Lifetimes need no intensity correction, but their [Q] is diluted like the intensities' (shared/engine/README.md, section 4).
  const lifetimeSeries = included.map((point) => ({
    concentration: correctPoint(settings, point, isRatio)?.concentration ?? point.concentration,
    lifetime: point.lifetime,
  }));
  const lifetime = lifetimeAnalysis(lifetimeSeries, settings.tau0, notes);
  const tau0 = tau0For(settings, lifetime?.tau0 ?? null);
  const limit = diffusionLimitFor(settings, notes);
  const parameters: Record<string, ParameterEstimate> = {};
  let band: BandPoint[];
  let fitted: (xi: number) => number;
  let statistics: FitResult['statistics'];
  let kForRate: ParameterEstimate | null = null;
  let yLabel = 'I0/I';
  let plotX = x;
  let plotY = ratios;

  if (model === 'linear-free' || model === 'linear-fixed') {
    const intercept = model === 'linear-free' ? 'free' : 'fixed-at-one';
    const fit = isRatio
      ? fitSternVolmer({
          concentrations: x,
          ratios,
          ...(sigmaRatios ? { ratioUncertainties: sigmaRatios } : {}),
          intercept,
        })
      : fitIntensitySternVolmer({
          concentrations: x,
          intensities: values,
          ...(sigmas ? { intensityUncertainties: sigmas } : {}),
          ...(settings.i0 !== null ? { i0: settings.i0 } : {}),
          intercept,
        });
    parameters.kSv = fit.kSv;
    if (fit.fittedIntercept) parameters.intercept = fit.fittedIntercept;
    flags.push(...fit.flags);
    kForRate = fit.kSv;
    const a = fit.fittedIntercept?.value ?? 1;
    fitted = (xi) => a + fit.kSv.value * xi;
    band = fit.fittedIntercept
      ? freeLineBand(
          x,
          ratios,
          sigmaRatios?.map((s) => 1 / (s * s)),
        )
      : fixedLineBand(x, fit.kSv.value, fit.kSv.standardError, fit.degreesOfFreedom);
    statistics = {
      n: fit.n,
      degreesOfFreedom: fit.degreesOfFreedom,
      rSquared: fit.rSquared,
      residualStandardDeviation: fit.residualStandardDeviation,
      curvature: fit.diagnosis.shape,
      curvaturePValue: fit.diagnosis.fTest?.pValue ?? null,
    };
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
      sum: fit.sum,
      product: fit.product,
      largerRoot: fit.largerRoot,
      smallerRoot: fit.smallerRoot,
    });
    if (fit.assignment.kind === 'resolved') {
      Object.assign(parameters, { kD: fit.assignment.kD, kS: fit.assignment.kS });
      kForRate = fit.assignment.kD;
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
      intensities: isRatio ? ratios.map((r) => 1 / r) : values,
      ...(isRatio ? { i0: 1 } : settings.i0 !== null ? { i0: settings.i0 } : {}),
    });
    Object.assign(parameters, { kSv: fit.kSv, accessibleFraction: fit.accessibleFraction });
    kForRate = fit.kSv;
    const quenched = used.flatMap((entry, i) => (entry.concentration > 0 ? [i] : []));
    plotX = quenched.map((i) => 1 / x[i]!);
    plotY = quenched.map((i) => (isRatio ? 1 / (1 - 1 / ratios[i]!) : fit.i0.value / (fit.i0.value - values[i]!)));
    fitted = (xi) => fit.line.intercept.value + fit.line.slope.value * xi;
    band = freeLineBand(plotX, plotY, undefined, Math.min(...plotX));
    yLabel = 'I0/(I0 − I) against 1/[Q]';
    statistics = {
      n: fit.n,
      degreesOfFreedom: fit.degreesOfFreedom,
      rSquared: fit.line.rSquared,
      residualStandardDeviation: null,
      curvature: null,
      curvaturePValue: null,
    };
  }

  let ratioToLimit: number | null = null;
  if (kForRate && tau0) {
    const rate = rateConstant(kForRate, statistics.degreesOfFreedom, tau0, limit);
    parameters.kq = rate.kq;
    ratioToLimit = rate.ratio;
    flags.push(...rate.flags);
  } else if (!tau0) notes.push('Enter tau0 (or add lifetimes with a blank) to turn K_SV into kq.');
  if (lifetime && tau0)
    parameters.kqFromLifetimes = rateConstant(lifetime.fit.kSv, lifetime.fit.degreesOfFreedom, tau0, limit).kq;

  const unique = [...new Map(flags.map((flag) => [flag.code, flag])).values()];
  return {
    model,
    kSv: parameters.kSv?.value ?? parameters.kD?.value ?? null,
    kq: parameters.kq?.value ?? null,
    pointsUsed: used.map((entry, i) => ({ position: entry.point.position, concentration: x[i]!, ratio: ratios[i]! })),
    result: {
      parameters,
      statistics,
      reference: { kind: isRatio ? 'ratio-data' : 'i0', value: i0.value, source: i0.source },
      tau0,
      diffusionLimit: limit ? { ...limit, ratio: ratioToLimit } : null,
      lifetime: lifetime
        ? { kSv: lifetime.fit.kSv, rSquared: lifetime.fit.rSquared, verdict: lifetime.verdict, points: lifetime.points }
        : null,
      flags: unique,
      notes,
      plot: {
        points: plotX.map((xi, i) => ({ x: xi, y: plotY[i]!, residual: plotY[i]! - fitted(xi) })),
        line: band,
        yLabel,
      },
    },
  };
}
