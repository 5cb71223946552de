import { linearRegression } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { correctPoint, fitStudy } from '@shared/engine';
import { fitPoint, fitSettings } from './support/study-fit-fixture';

const settings = fitSettings({ tau0: 1e-6 });
const point = fitPoint;
// Exact line I0/I = 1 + 500 [Q] (constructed, so K_SV = 500 M^-1 by hand).
const exact = [0, 1e-3, 2e-3, 3e-3, 4e-3, 5e-3].map((q, i) => point(i, q, 1000 / (1 + 500 * q)));

describe('points -> engine', () => {
  it('when the series is an exact Stern–Volmer line, then K_SV = 500 M^-1 and kq = K_SV / tau0 = 5e8 M^-1 s^-1 (hand-computed)', () => {
    const fit = fitStudy(settings, exact, 'linear-free');
    expect(fit.kSv).toBeCloseTo(500, 6);
    expect(fit.kq).toBeCloseTo(5e8, -1);
    expect(fit.result.reference).toMatchObject({ kind: 'i0', value: 1000 });
    // k_diff = 8RT/(3 eta) with eta(MeCN, 25 °C) = exp(-10.906 + 872.02/298.15) Pa s = 0.34182 mPa s
    // (Perry 8th ed. Table 2-313): 8 * 8.314462618 * 298.15 / (3 * 0.34182e-3) * 1000 = 1.9339e10 (hand-computed)
    expect(fit.result.diffusionLimit!.value).toBeCloseTo(1.9339e10, -7);
    expect(fit.result.diffusionLimit!.ratio).toBeCloseTo(5e8 / 1.9339e10, 4);
  });

  it('when the study runs at 50 °C, then k_diff uses the viscosity at 50 °C, not at 25 °C', () => {
    const fit = fitStudy({ ...settings, temperature: 323.15 }, exact, 'linear-free');
    // 8RT/(3 eta) with eta(MeCN, 50 °C) = 0.2801 mPa s (VDI Heat Atlas PPDS eq. 9, CalebBell/chemicals
    // coefficients): 7164.9 / 0.2801e-3 * 1000 = 2.558e10; Perry's 0.2726 gives 2.628e10 (3 % apart)
    expect(Math.abs(fit.result.diffusionLimit!.value / 2.558e10 - 1)).toBeLessThan(0.03);
    expect(fit.result.diffusionLimit!.basis).toMatch(/323\.15 K/);
  });

  it('when the points scatter, then the free-intercept slope equals simple-statistics linearRegression on (Q, I0/I)', () => {
    const noisy = [0, 1e-3, 2e-3, 3e-3, 4e-3, 5e-3].map((q, i) =>
      point(i, q, 1000 / (1 + 500 * q + [0, 0.02, -0.015, 0.01, -0.02, 0.012][i]!)),
    );
    const fit = fitStudy(settings, noisy, 'linear-free');
    const reference = linearRegression(fit.pointsUsed.map((p) => [p.concentration, p.ratio])); // simple-statistics 7.x
    expect(fit.kSv).toBeCloseTo(reference.m, 8);
    expect(fit.result.parameters.intercept!.value).toBeCloseTo(reference.b, 10);
  });

  it('when a point is excluded, then it stays in the series but is not used', () => {
    const withOutlier = [...exact, point(6, 6e-3, 100, { excluded: true })];
    const fit = fitStudy(settings, withOutlier, 'linear-fixed');
    expect(fit.pointsUsed.map((p) => p.position)).toEqual([0, 1, 2, 3, 4, 5]);
    expect(fit.kSv).toBeCloseTo(500, 6);
  });

  it('when kq exceeds the diffusion limit, then the flag is raised', () => {
    const fast = [0, 1e-3, 2e-3, 3e-3, 4e-3, 5e-3].map((q, i) => point(i, q, 1000 / (1 + 40000 * q)));
    const fit = fitStudy(settings, fast, 'linear-free'); // kq = 4e4 / 1e-6 = 4e10 > 1.93e10
    expect(fit.result.flags.map((flag) => flag.code)).toContain('KQ_ABOVE_DIFFUSION_LIMIT');
  });

  it('when the data hold ratios, then they are fitted as I0/I directly', () => {
    const ratios = [0, 1e-3, 2e-3, 3e-3, 4e-3].map((q, i) => point(i, q, 1 + 800 * q));
    expect(fitStudy({ ...settings, dataKind: 'ratio' }, ratios, 'linear-fixed').kSv).toBeCloseTo(800, 8);
  });

  it('when there is no blank and no I0, then the engine refuses with MISSING_I0', () => {
    expect(() => fitStudy(settings, exact.slice(1), 'linear-free')).toThrow(
      /i0: there is no point at zero quencher concentration/,
    );
  });

  it('when upward curvature comes from (1 + 300[Q])(1 + 100[Q]), then the combined model returns roots 300 and 100 (hand-computed)', () => {
    const curved = [0, 1e-3, 2e-3, 4e-3, 6e-3, 8e-3].map((q, i) => point(i, q, 1000 / ((1 + 300 * q) * (1 + 100 * q))));
    const fit = fitStudy({ ...settings, tau0: null }, curved, 'static-dynamic');
    expect(fit.result.parameters.largerRoot!.value).toBeCloseTo(300, 4);
    expect(fit.result.parameters.smallerRoot!.value).toBeCloseTo(100, 4);
  });

  it('when lifetimes are present, then tau0/tau is fitted and compared with the intensity slope', () => {
    const both = exact.map((p) => ({ ...p, lifetime: 1e-6 / (1 + 500 * p.concentration) }));
    const fit = fitStudy({ ...settings, tau0: null }, both, 'linear-free');
    expect(fit.result.lifetime!.kSv.value).toBeCloseTo(500, 6);
    // One lifetime blank gives τ0 without an uncertainty of its own: said, not taken as exact.
    expect(fit.result.tau0).toMatchObject({
      value: 1e-6,
      standardError: null,
      source: '1 lifetime blank at zero quencher, without uncertainty',
    });
    expect(fit.result.lifetime!.verdict).toMatch(/dynamic quenching/);
  });
});

describe('corrections', () => {
  const dilution = { ...settings, dilutionCorrection: true, initialVolume: 2e-3, stockConcentration: 0.1 };
  it('when 20 µL of 0.1 M stock go into 2 mL, then [Q] = 0.1 * 2e-5 / 2.02e-3 = 9.90099e-4 M and I is scaled by 1.01 (hand-computed)', () => {
    const corrected = correctPoint(dilution, point(1, 0, 90, { volumeAdded: 2e-5 }), false)!;
    expect(corrected.concentration).toBeCloseTo(9.90099e-4, 9);
    expect(corrected.intensity).toBeCloseTo(90.9, 10);
  });
  it('when absorbances are 0.1 and 0.05, then the inner-filter factor is 10^0.075 = 1.18850 (hand-computed)', () => {
    const corrected = correctPoint(
      { ...settings, innerFilterCorrection: true },
      point(1, 1e-3, 100, { absorbanceExcitation: 0.1, absorbanceEmission: 0.05 }),
      false,
    )!;
    expect(corrected.innerFilterFactor).toBeCloseTo(1.1885, 4);
    expect(corrected.intensity).toBeCloseTo(118.85, 2);
  });
  it('when a ratio is corrected, then it is divided by the factor (I0/I_corr = (I0/I)/f)', () => {
    const corrected = correctPoint(
      { ...settings, innerFilterCorrection: true },
      point(1, 1e-3, 2, { absorbanceExcitation: 0.1, absorbanceEmission: 0.05 }),
      true,
    )!;
    expect(corrected.intensity).toBeCloseTo(2 / 1.1885, 4);
  });
});

describe('lifetimes with the dilution correction on', () => {
  // shared/engine/README.md, section 4: [Q] = c_stock V_added / (V0 + V_added), I_corr = I_obs (V0 + V_added) / V0. V0 = 2.000 mL,
  // 0.100 M stock, cumulative additions 0, 20, 40, 60, 80 µL. Hand-computed (7 significant digits):
  //   [Q] = 0, 9.900990e-4, 1.960784e-3, 2.912621e-3, 3.846154e-3 M
  //   tau = 1 µs / (1 + 500 [Q]) = 1000, 668.8742, 504.9505, 407.1146, 342.1053 ns
  //   I_obs = 1000 / (1 + 500 [Q]) * V0 / (V0 + V_added) = 1000, 662.2517, 495.0495, 395.2569, 328.9474
  // The nominal (undiluted) [Q] = c_stock V_added / V0 = 0, 1, 2, 3, 4 mM is stored as the raw concentration.
  const added = [0, 20e-6, 40e-6, 60e-6, 80e-6];
  const lifetimesNs = [1000, 668.8742, 504.9505, 407.1146, 342.1053];
  const observed = [1000, 662.2517, 495.0495, 395.2569, 328.9474];
  const diluted = added.map((volume, i) =>
    point(i, i * 1e-3, observed[i]!, { volumeAdded: volume, lifetime: lifetimesNs[i]! * 1e-9 }),
  );
  const dilution = { ...settings, tau0: null, dilutionCorrection: true, initialVolume: 2e-3, stockConcentration: 0.1 };

  it('when lifetimes are fitted, then their [Q] are the diluted ones and tau0/tau gives 500 M^-1 like the intensities', () => {
    const fit = fitStudy(dilution, diluted, 'linear-free');
    const lifetime = fit.result.lifetime!;
    expect(lifetime.points.map((p) => p.x)).toEqual(
      [0, 9.90099e-4, 1.960784e-3, 2.912621e-3, 3.846154e-3].map((q) => expect.closeTo(q, 9)),
    );
    expect(lifetime.kSv.value).toBeCloseTo(500, 1); // the raw 0–4 mM would give about 481 M^-1
    expect(fit.kSv).toBeCloseTo(500, 1);
    expect(lifetime.verdict).toMatch(/dynamic quenching/);
  });

  it('when the dilution correction is off, then the lifetimes keep the stored concentrations', () => {
    const fit = fitStudy({ ...dilution, dilutionCorrection: false }, diluted, 'linear-free');
    expect(fit.result.lifetime!.points.map((p) => p.x)).toEqual([0, 1e-3, 2e-3, 3e-3, 4e-3]);
  });
});

describe('plot series carry their axes and the left-out points where they are drawn (issue 13, finding 11)', () => {
  // Exact line I0/I = 1 + 500 [Q] with the point at 2 mM left out: every expected coordinate below is hand-computed.
  const withLeftOut = exact.map((p) =>
    p.concentration === 2e-3 ? { ...p, excluded: true, intensity: 1000 / (1 + 500 * 2e-3) } : p,
  );

  it('when the line is fitted, then x is [Q] in mM (scale 1000) and the left-out point sits at (2 mM, 1 + 500 × 0.002 = 2)', () => {
    const { plot } = fitStudy(settings, withLeftOut, 'linear-fixed').result;
    expect(plot.xAxis).toEqual({ label: '[Q] (mM)', unit: 'mM', scale: 1000 });
    expect(plot.yLabel).toBe('I0/I');
    expect(plot.excluded).toEqual([{ position: 2, x: 2e-3, y: expect.closeTo(2, 12) }]);
    expect(plot.points.map((p) => p.position)).toEqual([0, 1, 3, 4, 5]);
  });

  it('when the modified model is fitted, then x is 1/[Q] in mM⁻¹ and the left-out point sits at (1/0.002 = 500 M⁻¹, I0/(I0 − I) = 1 + 1/(500 × 0.002) = 2)', () => {
    const { plot } = fitStudy(settings, withLeftOut, 'modified').result;
    // 1/[Q] in M⁻¹ × 1e-3 = 1/[Q] in mM⁻¹ (1 mM⁻¹ = 1000 M⁻¹)
    expect(plot.xAxis).toEqual({ label: '1/[Q] (mM⁻¹)', unit: 'mM⁻¹', scale: 1e-3 });
    expect(plot.yLabel).toBe('I0/(I0 − I)');
    expect(plot.excluded).toEqual([{ position: 2, x: expect.closeTo(500, 9), y: expect.closeTo(2, 9) }]);
    // the blank has no 1/[Q]: the plotted points are the four quenched ones that were used
    expect(plot.points.map((p) => p.position)).toEqual([1, 3, 4, 5]);
  });

  it('when the combined static+dynamic model is fitted, then the left-out point is on the [Q] axis at I0/I = (1 + 300 × 0.004)(1 + 100 × 0.004) = 3.08', () => {
    const curved = [0, 1e-3, 2e-3, 4e-3, 6e-3, 8e-3, 10e-3].map((q, i) =>
      point(i, q, 1000 / ((1 + 300 * q) * (1 + 100 * q)), { excluded: q === 4e-3 }),
    );
    const { plot } = fitStudy({ ...settings, tau0: null }, curved, 'static-dynamic').result;
    expect(plot.xAxis.label).toBe('[Q] (mM)');
    expect(plot.excluded).toEqual([{ position: 3, x: 4e-3, y: expect.closeTo(3.08, 12) }]);
  });

  it('when the study holds ratios, then the left-out ratio is drawn too (I0/I = 1 + 800 × 0.003 = 3.4)', () => {
    const ratios = [0, 1e-3, 2e-3, 3e-3, 4e-3, 5e-3].map((q, i) =>
      point(i, q, 1 + 800 * q, q === 3e-3 ? { excluded: true } : {}),
    );
    const fit = fitStudy({ ...settings, dataKind: 'ratio' }, ratios, 'linear-fixed');
    expect(fit.result.plot.excluded).toEqual([{ position: 3, x: 3e-3, y: expect.closeTo(3.4, 12) }]);
    const modified = fitStudy({ ...settings, dataKind: 'ratio' }, ratios, 'modified').result.plot;
    // from a ratio r: I0/(I0 − I) = 1/(1 − 1/r) = 3.4/2.4
    expect(modified.excluded).toEqual([
      { position: 3, x: expect.closeTo(1 / 3e-3, 9), y: expect.closeTo(3.4 / 2.4, 12) },
    ]);
  });

  it('when concentrations are micromolar, then the axis says µM (shared/units picks the unit that shows 50 µM as 50)', () => {
    const micro = [0, 10e-6, 20e-6, 30e-6, 40e-6, 50e-6].map((q, i) => point(i, q, 1000 / (1 + 2e4 * q)));
    const { plot, lifetime } = fitStudy(settings, micro, 'linear-free').result;
    expect(plot.xAxis).toEqual({ label: '[Q] (µM)', unit: 'µM', scale: expect.closeTo(1e6, 6) });
    expect(lifetime).toBeNull();
  });
});

describe('left-out points with the dilution correction on (issue 13, finding 11)', () => {
  // Same titration as above (V0 = 2.000 mL, 0.100 M stock); the 40 µL point left out. Hand-computed:
  // [Q] = 0.1 × 40e-6 / 2.04e-3 = 1.960784e-3 M; I_corr = 495.0495 × 2.04 / 2.00 = 504.9505; I0/I = 1000/504.9505 = 1.980392
  const added = [0, 20e-6, 40e-6, 60e-6, 80e-6];
  const observed = [1000, 662.2517, 495.0495, 395.2569, 328.9474];
  const diluted = added.map((volume, i) =>
    point(i, i * 1e-3, observed[i]!, { volumeAdded: volume, excluded: i === 2 }),
  );
  const dilution = { ...settings, dilutionCorrection: true, initialVolume: 2e-3, stockConcentration: 0.1 };

  it('when a point is left out, then its marker is at the corrected [Q] and I0/I, not the stored ones', () => {
    const { plot } = fitStudy(dilution, diluted, 'linear-free').result;
    expect(plot.excluded).toEqual([{ position: 2, x: expect.closeTo(1.960784e-3, 9), y: expect.closeTo(1.980392, 5) }]);
    expect(plot.points.map((p) => p.x)).toEqual(
      [0, 9.90099e-4, 2.912621e-3, 3.846154e-3].map((q) => expect.closeTo(q, 9)),
    );
  });
});

describe('replicate runs in one study', () => {
  // Invented runs of one pair: I = I0 / (1 + 400 [Q]) with lamp output I0 = 1000 (run 1) and 800 (run 2).
  const qs = [0, 1e-3, 2e-3, 3e-3, 4e-3];
  const runs = [1, 2].flatMap((series) =>
    qs.map((q, i) =>
      point((series - 1) * qs.length + i, q, (series === 1 ? 1000 : 800) / (1 + 400 * q), {
        series,
        excluded: series === 2 && q === 3e-3,
      }),
    ),
  );

  it('when two runs had different lamp output, then each is normalised by its own I0 and K_SV = 400 M^-1 (constructed)', () => {
    const fit = fitStudy(settings, runs, 'linear-free');
    expect(fit.kSv).toBeCloseTo(400, 8);
    expect(fit.result.reference.kind).toBe('replicate-runs');
    expect(fit.result.replicates!.runs.map((run) => run.value)).toEqual([1000, 800]);
    expect(fit.result.replicates!.summary.find((row) => row.concentration === 3e-3)).toMatchObject({ n: 1 });
    // the left-out run-2 reading, with run 2's own I0: 800 / (800 / 2.2) = 1 + 400 × 0.003 = 2.2
    expect(fit.result.plot.excluded).toEqual([{ position: 8, x: 3e-3, y: expect.closeTo(2.2, 12) }]);
    expect(fit.result.replicates!.weighting).toBeNull(); // no σ and no scatter: no weights
  });

  it('when the runs scatter, then the weighted fit by the replicate scatter is shown beside the unweighted one', () => {
    const noisy = runs.map((p, i) => ({
      ...p,
      excluded: false,
      intensity: p.intensity! * (1 + 0.02 * Math.sin(1.7 * i)), // invented scatter of about 2 %
    }));
    const fit = fitStudy(settings, noisy, 'linear-fixed');
    const weighting = fit.result.replicates!.weighting!;
    expect(weighting.source).toBe('replicate-scatter');
    expect(weighting.shift).toBeCloseTo(weighting.weighted.value - weighting.unweighted.value, 9);
  });
});
