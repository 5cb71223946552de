import { linearRegression, mean, sampleStandardDeviation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { compareWeighting, poolReplicates } from '@shared/engine';

// Invented readings (demo-style numbers, not measurements); every expected value is computed
// independently below: by hand, from the closed form written out, or with simple-statistics.
const reading = (series: number, concentration: number, intensity: number, uncertainty: number | null = null) => ({
  series,
  concentration,
  intensity,
  uncertainty,
});
const qs = [0, 1e-3, 2e-3, 3e-3, 4e-3];

describe('poolReplicates', () => {
  it('when two runs of one pair had different lamp output, then each is normalised by its own I0 and they pool onto one line', () => {
    // I = I0 / (1 + 400 [Q]) with I0 = 1000 in run 1 and 800 in run 2: both give I0/I = 1 + 400 [Q] exactly.
    const readings = [1, 2].flatMap((series) =>
      qs.map((q) => reading(series, q, (series === 1 ? 1000 : 800) / (1 + 400 * q))),
    );
    const pooled = poolReplicates(readings);
    expect(pooled.i0.map((entry) => entry.value)).toEqual([1000, 800]);
    expect(pooled.summary.map((entry) => entry.mean)).toEqual(qs.map((q) => expect.closeTo(1 + 400 * q, 12)));
    expect(pooled.summary.map((entry) => entry.n)).toEqual([2, 2, 2, 2, 2]);
  });

  it('when readings scatter between runs, then each concentration shows mean ± SD and the SD weights its readings (simple-statistics mean, sampleStandardDeviation)', () => {
    const scatter = [
      [1000, 700, 560, 450, 380],
      [1000, 720, 540, 470, 370],
      [1000, 690, 575, 455, 390],
    ];
    const readings = scatter.flatMap((run, s) => run.map((intensity, i) => reading(s + 1, qs[i]!, intensity)));
    const pooled = poolReplicates(readings);
    for (const [i, q] of qs.entries()) {
      const ratios = scatter.map((run) => 1000 / run[i]!);
      const entry = pooled.summary.find((row) => row.concentration === q)!;
      expect(entry.mean).toBeCloseTo(mean(ratios), 12);
      if (q > 0) expect(entry.sd).toBeCloseTo(sampleStandardDeviation(ratios), 12);
    }
    expect(pooled.weightSource).toBe('replicate-scatter');
    const at2 = pooled.ratios.filter((entry) => entry.concentration === 2e-3);
    expect(at2.map((entry) => entry.sigma)).toEqual(
      at2.map(() => expect.closeTo(sampleStandardDeviation(scatter.map((run) => 1000 / run[2]!)), 12)),
    );
  });

  it('when every reading has its σ, then σ(I0/I) = r √((σ_I/I)² + (σ_I0/I0)²) with σ_I0 the SE of the blank mean (Bevington & Robinson ch. 3, by hand)', () => {
    const pooled = poolReplicates([
      reading(1, 0, 1000, 10),
      reading(1, 0, 1010, 10),
      reading(1, 2e-3, 500, 10),
      reading(1, 4e-3, 340, 10),
    ]);
    // I0 = 1005; SE = sample SD 7.0710678 / √2 = 5; r = 1005/500 = 2.01;
    // σ_r = 2.01 × √((10/500)² + (5/1005)²) = 2.01 × √(4e-4 + 2.47519e-5) = 2.01 × 0.0206096 = 0.0414253
    expect(pooled.i0[0]).toEqual({ series: 1, value: 1005, standardError: expect.closeTo(5, 12), blanks: 2 });
    expect(pooled.ratios[2]!.sigma).toBeCloseTo(0.0414253, 6);
    expect(pooled.weightSource).toBe('point-uncertainties');
  });

  it('when a run has no blank and no I0 is given, then the error names the run', () => {
    expect(() => poolReplicates([reading(1, 0, 1000), reading(1, 1e-3, 700), reading(2, 1e-3, 690)])).toThrow(
      /series 2 has no point at zero/,
    );
  });
});

describe('compareWeighting', () => {
  // x in M, ratios and σ invented; weights 1/σ² = 4, 1, 1, 4 (relative).
  const x = [1e-3, 2e-3, 3e-3, 4e-3];
  const r = [1.5, 1.9, 2.6, 3.0];
  const sigma = [0.5, 1, 1, 0.5];
  const pooled = {
    i0: [{ series: 1, value: 1, standardError: null, blanks: 0 }],
    ratios: x.map((q, i) => ({ series: 1, concentration: q, ratio: r[i]!, sigma: sigma[i]! })),
    summary: [],
    weightSource: 'point-uncertainties' as const,
  };

  it('when weights are given, then the slope is the closed form b = (ΣwΣwxy − ΣwxΣwy)/Δ (Bevington & Robinson, ch. 6, eq. 6.12, by hand)', () => {
    const w = sigma.map((s) => 1 / (s * s));
    const S = w.reduce((a, b) => a + b, 0);
    const Sx = w.reduce((a, wi, i) => a + wi * x[i]!, 0);
    const Sy = w.reduce((a, wi, i) => a + wi * r[i]!, 0);
    const Sxx = w.reduce((a, wi, i) => a + wi * x[i]! ** 2, 0);
    const Sxy = w.reduce((a, wi, i) => a + wi * x[i]! * r[i]!, 0);
    const delta = S * Sxx - Sx * Sx;
    const slope = (S * Sxy - Sx * Sy) / delta;
    const intercept = (Sxx * Sy - Sx * Sxy) / delta;
    // χ²/ν scales the absolute variance Σw/Δ (weights taken as relative, as in fitLine)
    const chi2 = w.reduce((a, wi, i) => a + wi * (r[i]! - intercept - slope * x[i]!) ** 2, 0);
    const comparison = compareWeighting(pooled);
    expect(comparison.weighted.kSv.value).toBeCloseTo(slope, 9);
    expect(comparison.weighted.fittedIntercept!.value).toBeCloseTo(intercept, 12);
    expect(comparison.weighted.kSv.standardError).toBeCloseTo(Math.sqrt((S / delta) * (chi2 / 2)), 9);
  });

  it('when the weights are whole numbers, then the weighted line equals simple-statistics linearRegression on the points repeated w times', () => {
    const repeated = x.flatMap((q, i) => Array.from({ length: 1 / sigma[i]! ** 2 }, () => [q, r[i]!]));
    const reference = linearRegression(repeated);
    const comparison = compareWeighting(pooled);
    expect(comparison.weighted.kSv.value).toBeCloseTo(reference.m, 9);
    expect(comparison.weighted.fittedIntercept!.value).toBeCloseTo(reference.b, 12);
    // the unweighted fit of the same four points, as simple-statistics gives it
    expect(comparison.unweighted.kSv.value).toBeCloseTo(linearRegression(x.map((q, i) => [q, r[i]!])).m, 9);
  });

  it('when one imprecise reading pulls the unweighted line, then weighting moves K_SV by more than its SE and says so', () => {
    // I0/I = 1 + 500 [Q] exactly, σ = 0.005, except the 5 mM reading: +0.5 with σ = 0.5.
    const ratios = [1e-3, 2e-3, 3e-3, 4e-3, 5e-3].map((q, i) => ({
      series: 1,
      concentration: q,
      ratio: 1 + 500 * q + (i === 4 ? 0.5 : 0),
      sigma: i === 4 ? 0.5 : 0.005,
    }));
    const comparison = compareWeighting({ ...pooled, ratios }, 'fixed-at-one');
    expect(comparison.weighted.kSv.value).toBeCloseTo(500, -1);
    expect(comparison.beyondStandardError).toBe(true);
    expect(comparison.shift).toBeLessThan(-comparison.unweighted.kSv.standardError);
  });

  it('when nothing gives a weight, then it refuses and says what to measure', () => {
    expect(() => compareWeighting({ ...pooled, weightSource: null })).toThrow(/two differing replicates/);
  });
});
