import { describe, expect, it } from 'vitest';
import {
  convolveExponential,
  decayWorkspace,
  evaluateDecayModel,
  meanLifetimes,
  residualAutocorrelation,
} from '@shared/engine';
import type { DecayModelSetup } from '@shared/engine';
import { expectClose } from '../support/expect-close';

/**
 * The weight of exp(-x w) between channels by direct numerical integration, independent of the
 * engine's closed forms: the lag w = a + D with D = u - v of two uniform positions has the
 * triangular density 1 - |D| on [-1, 1]; composite Simpson on each smooth piece (split where
 * a + D = 0 and D = 0), 2,000 panels each.
 */
function kernelByQuadrature(a: number, x: number): number {
  const f = (d: number) => (a + d > 0 ? (1 - Math.abs(d)) * Math.exp(-x * (a + d)) : 0);
  const cuts = [-1, Math.max(-1, Math.min(1, -a)), 0, 1].sort((p, q) => p - q);
  let total = 0;
  for (let k = 0; k + 1 < cuts.length; k++) {
    const [lo, hi] = [cuts[k]!, cuts[k + 1]!];
    if (hi <= lo) continue;
    const panels = 2000;
    const h = (hi - lo) / panels;
    // midpoints of the ends avoid evaluating exactly on the step at a + D = 0
    let sum = f(lo + 1e-12) + f(hi - 1e-12);
    for (let j = 1; j < panels; j++) sum += (j % 2 === 1 ? 4 : 2) * f(lo + j * h);
    total += (sum * h) / 3;
  }
  return total;
}

describe('convolveExponential (recursive reconvolution)', () => {
  const response = Array.from({ length: 48 }, (_, i) => Math.exp(-0.5 * ((i - 12) / 2.1) ** 2));

  it('equals the O(n^2) sum of the numerically integrated channel weights, for whole and fractional shifts', () => {
    for (const [shift, x] of [
      [0, 0.1],
      [0.37, 0.1],
      [-1.6, 0.5],
      [2.25, 0.004],
      [0.9, 3],
    ] as const) {
      const fast = new Float64Array(response.length);
      convolveExponential(response, shift, x, fast);
      for (let i = 0; i < response.length; i += 5) {
        let direct = 0;
        for (let j = 0; j < response.length; j++) {
          const lag = i - j - shift;
          if (lag <= -1) continue;
          direct +=
            response[j]! *
            (lag >= 1 ? kernelByQuadrature(1, x) * Math.exp(-x * (lag - 1)) : kernelByQuadrature(lag, x));
        }
        expectClose(fast[i]!, direct, 1e-7);
      }
    }
  });

  it('gives derivatives by ln(tau) and by the shift that match central differences', () => {
    for (const [shift, x] of [
      [0, 0.1],
      [0.37, 0.02],
      [-1.6, 0.5],
    ] as const) {
      const n = response.length;
      const [y, byLifetime, byShift, up, down] = Array.from({ length: 5 }, () => new Float64Array(n));
      convolveExponential(response, shift, x, y, byLifetime, byShift);
      const h = 1e-6;
      convolveExponential(response, shift + h, x, up);
      convolveExponential(response, shift - h, x, down);
      for (let i = 0; i < n; i++) expect(Math.abs((up[i]! - down[i]!) / (2 * h) - byShift[i]!)).toBeLessThan(1e-6);
      // ln tau up by h: x down by the factor e^-h
      convolveExponential(response, shift, x * Math.exp(-h), up);
      convolveExponential(response, shift, x * Math.exp(h), down);
      for (let i = 0; i < n; i++) expect(Math.abs((up[i]! - down[i]!) / (2 * h) - byLifetime[i]!)).toBeLessThan(1e-6);
    }
  });

  it('tends to the sampled exponential when tau spans many channels (x -> 0)', () => {
    const out = new Float64Array(6);
    convolveExponential([1, 0, 0, 0, 0, 0], 0, 1e-6, out);
    // k0 -> 1/2 and g q^d -> 1 (common practice: half the prompt channel, then the full decay)
    expectClose(out[0]!, 0.5, 1e-5);
    expectClose(out[5]!, 1, 1e-5);
  });
});

describe('evaluateDecayModel', () => {
  it('has an analytic Jacobian equal to central differences, reconvolution and tail', () => {
    const n = 64;
    const response = new Float64Array(n);
    for (let i = 0; i < n; i++) response[i] = Math.exp(-0.5 * ((i - 10) / 1.5) ** 2);
    const cases: Array<[DecayModelSetup, number[]]> = [
      [
        { method: 'reconvolution', components: 2, channels: n, response, origin: 0, end: n - 1 },
        [Math.log(5), Math.log(20), 300, 100, 2, 0.4],
      ],
      [
        { method: 'tail', components: 2, channels: n, response: null, origin: 8, end: n - 1 },
        [Math.log(4), Math.log(30), 500, 80, 3],
      ],
    ];
    for (const [setup, parameters] of cases) {
      const columns = parameters.map(() => new Float64Array(n));
      const base = new Float64Array(n);
      const workspace = decayWorkspace(n);
      evaluateDecayModel(setup, parameters, base, columns, workspace);
      parameters.forEach((_, k) => {
        const h = 1e-6 * Math.max(1, Math.abs(parameters[k]!));
        const up = new Float64Array(n);
        const down = new Float64Array(n);
        evaluateDecayModel(
          setup,
          parameters.map((v, j) => (j === k ? v + h : v)),
          up,
          null,
          workspace,
        );
        evaluateDecayModel(
          setup,
          parameters.map((v, j) => (j === k ? v - h : v)),
          down,
          null,
          workspace,
        );
        for (let i = setup.origin; i < n; i++) {
          const numeric = (up[i]! - down[i]!) / (2 * h);
          expect(Math.abs(numeric - columns[k]![i]!)).toBeLessThan(1e-5 * Math.max(1, Math.abs(numeric)));
        }
      });
    }
  });
});

describe('meanLifetimes (Lakowicz, 3rd ed., ch. 4)', () => {
  it('60 % of 2.0 ns and 40 % of 6.5 ns: amplitude-weighted 3.8 ns, intensity-weighted 5.079 ns', () => {
    // hand calculation: (0.6*2 + 0.4*6.5) = 3.8; (0.6*4 + 0.4*42.25)/3.8 = 19.3/3.8 = 5.078947...
    const zero = [0, 1, 2, 3].map(() => [0, 0, 0, 0]);
    const means = meanLifetimes([2, 6.5], [0.6, 0.4], zero);
    expectClose(means.amplitudeWeighted.value, 3.8, 1e-12);
    expectClose(means.intensityWeighted.value, 19.3 / 3.8, 1e-12);
  });

  it('propagates a lifetime variance: one exponential gives the lifetime SE itself', () => {
    // var(ln tau) = 0.01^2 -> SE(tau) = 0.01 tau (first-order propagation, hand calculation)
    const means = meanLifetimes(
      [4],
      [100],
      [
        [1e-4, 0],
        [0, 25],
      ],
    );
    expectClose(means.amplitudeWeighted.standardError, 0.04, 1e-12);
    expectClose(means.intensityWeighted.standardError, 0.04, 1e-12);
  });
});

describe('residualAutocorrelation', () => {
  it('is 1 at lag 0 and -1 at lag 1 for alternating signs (hand calculation)', () => {
    expect(residualAutocorrelation([1, -1, 1, -1, 1, -1], 2)).toEqual([1, -1, 1]);
  });
});
