import { linearRegression, sampleStandardDeviation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { fitStudy } from '@shared/engine';
import { expectClose } from './support/expect-close';
import { fitPoint, fitSettings } from './support/study-fit-fixture';

const sum = (values: readonly number[]) => values.reduce((total, value) => total + value, 0);

/**
 * Weighted straight line y = a + b x with w = 1/σ², Bevington & Robinson, Data Reduction and Error
 * Analysis for the Physical Sciences, 3rd ed., ch. 6, eq. 6.12, written out here from the book:
 * Δ = Σw Σwx² − (Σwx)², b = (Σw Σwxy − Σwx Σwy)/Δ, a = (Σwx² Σwy − Σwx Σwxy)/Δ.
 */
function weightedLine(x: readonly number[], y: readonly number[], sigma: readonly number[]) {
  const w = sigma.map((s) => 1 / (s * s));
  const sw = sum(w);
  const swx = sum(w.map((wi, i) => wi * x[i]!));
  const swy = sum(w.map((wi, i) => wi * y[i]!));
  const swxx = sum(w.map((wi, i) => wi * x[i]! * x[i]!));
  const swxy = sum(w.map((wi, i) => wi * x[i]! * y[i]!));
  const delta = sw * swxx - swx * swx;
  return { slope: (sw * swxy - swx * swy) / delta, intercept: (swxx * swy - swx * swxy) / delta };
}

/** The line through (0, 1): minimising Σ w (y − 1 − K x)² gives K = Σ w x (y − 1) / Σ w x² (hand-derived). */
const weightedSlopeThroughOne = (x: readonly number[], y: readonly number[], sigma: readonly number[]) =>
  sum(x.map((xi, i) => (xi * (y[i]! - 1)) / sigma[i]! ** 2)) / sum(x.map((xi, i) => (xi * xi) / sigma[i]! ** 2));

// Invented series near I0/I = 1 + 500 [Q] with a scatter of a few per cent.
const qs = [0, 1e-3, 2e-3, 3e-3, 4e-3, 5e-3];
const noise = [0, 0.03, -0.02, 0.025, -0.03, 0.02];
const ratios = qs.map((q, i) => 1 + 500 * q + noise[i]!);
// σ = 1/√k gives whole-number weights k, so the weighted fit equals an unweighted one on each point taken k times.
const weights = [1, 2, 3, 4, 3, 2];
const ratioSeries = qs.map((q, i) => fitPoint(i, q, ratios[i]!, { uncertainty: 1 / Math.sqrt(weights[i]!) }));

describe('the weighted choice (weights 1/σ² of I0/I)', () => {
  it('when ratios with whole-number weights are fitted weighted, then K_SV equals simple-statistics on each point repeated by its weight, and the closed form', () => {
    const fit = fitStudy(fitSettings({ dataKind: 'ratio', fitWeighting: 'weighted' }), ratioSeries, 'linear-free');
    // simple-statistics 7.x linearRegression on the expanded points (point i taken weights[i] times)
    const expanded = qs.flatMap((q, i) => Array.from({ length: weights[i]! }, () => [q, ratios[i]!]));
    const reference = linearRegression(expanded);
    expectClose(fit.kSv!, reference.m, 1e-10);
    expectClose(fit.result.parameters.intercept!.value, reference.b, 1e-10);
    expectClose(
      fit.kSv!,
      weightedLine(
        qs,
        ratios,
        ratioSeries.map((p) => p.uncertainty!),
      ).slope,
      1e-10,
    );
    expect(fit.result.weighting).toEqual({
      chosen: 'weighted',
      applied: 'point-uncertainties',
      pointsWeighted: 6,
      reason: null,
    });
  });

  it('when the same ratios are fitted unweighted, then K_SV is simple-statistics linearRegression on the points as they are', () => {
    const fit = fitStudy(fitSettings({ dataKind: 'ratio' }), ratioSeries, 'linear-free');
    expectClose(fit.kSv!, linearRegression(qs.map((q, i) => [q, ratios[i]!])).m, 1e-10); // simple-statistics 7.x
    expect(fit.result.weighting).toMatchObject({ chosen: 'unweighted', applied: 'unweighted', pointsWeighted: null });
    expect(fit.result.notes).toContain(
      'Every point has an uncertainty: choose the weighted fit to weigh them by 1/σ².',
    );
  });

  it('when intensities carry σ_I and the fit is weighted, then K_SV and kq follow the closed form on I0/I with σ = (I0/I) σ_I / I', () => {
    // Invented single run, I0 = 1000 from its one blank; σ_I invented per reading.
    const intensities = ratios.map((r) => 1000 / r);
    const sigmaI = [10, 8, 12, 6, 9, 5];
    const points = qs.map((q, i) => fitPoint(i, q, intensities[i]!, { uncertainty: sigmaI[i]! }));
    const settings = fitSettings({ fitWeighting: 'weighted', tau0: 1e-6 });
    const fit = fitStudy(settings, points, 'linear-free');
    // first-order propagation for a quotient with I0 exact (Bevington & Robinson ch. 3, eq. 3.14)
    const sigmaR = intensities.map((intensity, i) => (1000 / intensity) * (sigmaI[i]! / intensity));
    const expected = weightedLine(qs, ratios, sigmaR).slope;
    expectClose(fit.kSv!, expected, 1e-9);
    expectClose(fit.kq!, expected / 1e-6, 1e-9); // kq = K_SV / τ0
    expect(fit.result.parameters.kSv!.includes).toMatch(/points' own uncertainties/);
    const plain = fitStudy({ ...settings, fitWeighting: 'unweighted' }, points, 'linear-free');
    expectClose(plain.kSv!, linearRegression(qs.map((q, i) => [q, ratios[i]!])).m, 1e-9); // simple-statistics 7.x
  });

  it('when the line is fixed through 1 and weighted, then K_SV = Σ w x (y − 1) / Σ w x² (hand-derived)', () => {
    const fit = fitStudy(fitSettings({ dataKind: 'ratio', fitWeighting: 'weighted' }), ratioSeries, 'linear-fixed');
    const sigma = ratioSeries.map((p) => p.uncertainty!);
    expectClose(fit.kSv!, weightedSlopeThroughOne(qs, ratios, sigma), 1e-10);
  });

  it('when replicate runs scatter and the fit is weighted, then each I0/I is weighted by the sample SD at its [Q] and the σ-less blanks are left out', () => {
    // Three invented runs with lamp outputs 1000, 900 and 1100 and different scatter.
    const scatter = [
      [0, 0.02, -0.01, 0.03, -0.02, 0.01],
      [0, -0.015, 0.02, -0.01, 0.025, -0.02],
      [0, 0.005, -0.025, 0.015, 0.01, 0.03],
    ];
    const lamp = [1000, 900, 1100];
    const points = scatter.flatMap((offsets, run) =>
      qs.map((q, i) => fitPoint(run * qs.length + i, q, lamp[run]! / (1 + 500 * q + offsets[i]!), { series: run + 1 })),
    );
    const fit = fitStudy(fitSettings({ fitWeighting: 'weighted' }), points, 'linear-free');
    // each run by its own I0 (its one blank): I0/I = 1 + 500 [Q] + offset; σ at a [Q] = simple-statistics sampleStandardDeviation of the three
    const quenched = qs.slice(1);
    const x = quenched.flatMap((q) => [q, q, q]);
    const y = quenched.flatMap((q, i) => scatter.map((offsets) => 1 + 500 * q + offsets[i + 1]!));
    const sd = quenched.map((q, i) => sampleStandardDeviation(scatter.map((offsets) => 1 + 500 * q + offsets[i + 1]!)));
    const sigma = sd.flatMap((s) => [s, s, s]);
    expectClose(fit.kSv!, weightedLine(x, y, sigma).slope, 1e-9);
    expect(fit.result.weighting).toEqual({
      chosen: 'weighted',
      applied: 'replicate-scatter',
      pointsWeighted: 15,
      reason: null,
    });
    expect(fit.result.replicates!.weighting!.weighted.value).toBeCloseTo(fit.kSv!, 9);
    expect(fit.result.notes.join(' ')).toMatch(/3 blank\(s\) without an uncertainty .* left out of the weighted fit/);
  });

  it('when weights were chosen but the points do not give them, then the fit is unweighted and says why', () => {
    const partly = ratioSeries.map((p, i) => (i === 3 ? { ...p, uncertainty: null } : p));
    const fit = fitStudy(fitSettings({ dataKind: 'ratio', fitWeighting: 'weighted' }), partly, 'linear-free');
    expectClose(fit.kSv!, linearRegression(qs.map((q, i) => [q, ratios[i]!])).m, 1e-10); // simple-statistics 7.x
    expect(fit.result.weighting).toMatchObject({
      applied: 'unweighted',
      reason: expect.stringMatching(/not every point/),
    });
    const modified = fitStudy(fitSettings({ dataKind: 'ratio', fitWeighting: 'weighted' }), ratioSeries, 'modified');
    expect(modified.result.weighting!.reason).toMatch(/straight-line models only/);
  });
});
