import { linearRegression } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import {
  analyseTemperatureSeries,
  BOLTZMANN_CONSTANT,
  fitActivation,
  GAS_CONSTANT,
  getSolvent,
  PLANCK_CONSTANT,
  viscosityAt,
  type TemperaturePoint,
} from '@shared/engine';
import { expectClose } from './support/expect-close';
import { seededNormal } from './support/seeded-random';

const R = GAS_CONSTANT;
const temperatures = [283.15, 293.15, 303.15, 313.15, 323.15];
const acetonitrile = getSolvent('acetonitrile').viscosityCorrelation!;
const eta = (t: number) => viscosityAt(acetonitrile, t).value;
const tau0 = 1e-6;

/** Synthetic series (invented numbers): kq(T) given, K_SV = kq tau0 with 2 % multiplicative noise. */
function series(kq: (t: number) => number, seed: number, noise = 0.02): TemperaturePoint[] {
  const normal = seededNormal(seed);
  return temperatures.map((temperature) => {
    const k = kq(temperature) * (1 + noise * normal());
    return { temperature, kSv: k * tau0, kSvStandardError: k * tau0 * noise, viscosity: eta(temperature), kq: k };
  });
}

describe('temperature series: Arrhenius and Eyring', () => {
  it('recovers a known Ea of 15 kJ/mol: the 95 % interval covers it in 95 % of 400 noisy series', () => {
    const ea = 15_000;
    let covered = 0;
    let withinOneSe = 0;
    for (let seed = 1; seed <= 400; seed++) {
      const fit = analyseTemperatureSeries(series((t) => 1e12 * Math.exp(-ea / (R * t)), seed)).activation!;
      const { value, standardError, interval95 } = fit.activationEnergy;
      if (interval95.lower <= ea && ea <= interval95.upper) covered++;
      if (Math.abs(value - ea) <= standardError) withinOneSe++;
    }
    // binomial(400, 0.95): SD 1.1 %, so 3 SD either side
    expect(covered / 400).toBeGreaterThan(0.917);
    expect(covered / 400).toBeLessThan(0.983);
    // within one SE: P(|t| < 1) with 3 degrees of freedom = 0.609 (Student's t; SD 2.4 % at n = 400)
    expect(Math.abs(withinOneSe / 400 - 0.609)).toBeLessThan(0.075);
    const one = analyseTemperatureSeries(series((t) => 1e12 * Math.exp(-ea / (R * t)), 1)).activation!;
    expect(Math.abs(one.activationEnergy.value - ea)).toBeLessThan(one.activationEnergy.standardError);
    expect(one.activationEnergy.standardError).toBeLessThan(1500); // 2 % noise over 40 K: about 0.6–1 kJ/mol
  });

  it('matches simple-statistics linearRegression on (1/T, ln k) and (1/T, ln(k h / kB T))', () => {
    const t = [280, 300, 320, 340];
    const k = [1.1e9, 2.3e9, 3.6e9, 6.1e9]; // invented
    const fit = fitActivation(t, k);
    const arrhenius = linearRegression(t.map((ti, i) => [1 / ti, Math.log(k[i]!)])); // simple-statistics 7.x
    const eyring = linearRegression(
      t.map((ti, i) => [1 / ti, Math.log((k[i]! * PLANCK_CONSTANT) / (BOLTZMANN_CONSTANT * ti))]),
    );
    expectClose(fit.activationEnergy.value, -R * arrhenius.m, 1e-10);
    expectClose(fit.lnPreExponentialFactor.value, arrhenius.b, 1e-10);
    expectClose(fit.activationEnthalpy.value, -R * eyring.m, 1e-10);
    expectClose(fit.activationEntropy.value, R * eyring.b, 1e-10);
    // dH‡ = Ea - R T for any T-independent A (exactly: slopes differ by the T in kB T/h)
    expectClose(
      fit.activationEnergy.value - fit.activationEnthalpy.value,
      R / (t.reduce((a, b) => a + 1 / b, 0) / 4),
      0.01,
    );
  });

  it('standard error of Ea by hand: R s / sqrt(Sxx) with s^2 = SS_res / (n - 2)', () => {
    const t = [280, 300, 320];
    const k = [1e9, 2e9, 3.5e9];
    const x = t.map((ti) => 1 / ti);
    const y = k.map((ki) => Math.log(ki));
    const line = linearRegression(x.map((xi, i) => [xi, y[i]!]));
    const mean = x.reduce((a, b) => a + b) / 3;
    const sxx = x.reduce((a, xi) => a + (xi - mean) ** 2, 0);
    const ssRes = x.reduce((a, xi, i) => a + (y[i]! - line.b - line.m * xi) ** 2, 0);
    expectClose(fitActivation(t, k).activationEnergy.standardError, R * Math.sqrt(ssRes / 1 / sxx), 1e-9);
  });

  it('refuses fewer than 3 temperatures', () => {
    expect(() => fitActivation([300, 300, 310], [1e9, 1.1e9, 1.3e9])).toThrowError(
      /at least 3 distinct temperatures, got 2/,
    );
  });
});

describe('temperature series: verdict', () => {
  it('diffusion-controlled kq (half of 8RT/3eta) reads "dynamic", with Ea beside the viscous-flow energy', () => {
    const points = series((t) => 0.5 * ((8 * R * t) / (3 * eta(t))) * 1000, 3);
    const analysis = analyseTemperatureSeries(points);
    expect(analysis.verdict).toBe('dynamic');
    // Perry's MeCN row is ln eta = C1 + C2/T, so E_eta = R * 872.02 = 7.25 kJ/mol exactly
    expectClose(analysis.viscousFlowActivationEnergy, R * 872.02, 1e-9);
    // kq ∝ T/eta: Ea = E_eta + R T (about 7.25 + 2.5 kJ/mol), within the fit's SE
    const ea = analysis.activation!.activationEnergy;
    expect(Math.abs(ea.value - (R * 872.02 + R * 303))).toBeLessThan(2 * ea.standardError);
    expect(analysis.reasons.join(' ')).toMatch(/in step with T\/η/);
  });

  it('a ground-state complex (K falls, dH = -20 kJ/mol) reads "static"', () => {
    const kS = (t: number) => 200 * Math.exp((20_000 / R) * (1 / t - 1 / 298.15));
    const points = series((t) => kS(t) / tau0, 11);
    const analysis = analyseTemperatureSeries(points);
    expect(analysis.verdict).toBe('static');
    expect(analysis.kSvFold).toBeLessThan(0.5);
    expect(analysis.reasons.join(' ')).toMatch(/falls as the temperature rises/);
  });

  it('a flat K_SV within its noise reads "mixed or unclear"', () => {
    const points = series(() => 1e9, 5);
    expect(analyseTemperatureSeries(points).verdict).toBe('mixed-or-unclear');
  });

  it('without tau0 at every temperature, no Arrhenius fit and a note saying why', () => {
    const points = series((t) => 0.5 * ((8 * R * t) / (3 * eta(t))) * 1000, 3).map((p, i) =>
      i === 2 ? { ...p, kq: null } : p,
    );
    const analysis = analyseTemperatureSeries(points);
    expect(analysis.activation).toBeNull();
    expect(analysis.activationNote).toMatch(/tau0, at every temperature/);
  });

  it('refuses a series with fewer than 3 distinct temperatures', () => {
    const points = series(() => 1e9, 1).slice(0, 2);
    expect(() => analyseTemperatureSeries(points)).toThrowError(expect.objectContaining({ code: 'TOO_FEW_POINTS' }));
  });
});
