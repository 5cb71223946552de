import { describe, expect, it } from 'vitest';
import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { decayWorkspace, evaluateDecayModel, fitDecay, prepareResponse } from '@shared/engine';
import { expectClose } from '../support/expect-close';
import { seededPoisson, syntheticDecay, type SyntheticDecayOptions } from '../support/synthetic-decay';

// A laser-diode TCSPC set-up (invented for the tests): 1,024 channels of 50 ps, a Gaussian
// response of 200 ps FWHM at 3 ns, peak 10^4 counts, 3 counts of background (issue 17's recipe).
const TCSPC = { channels: 1024, channelWidth: 50e-12, responseCentre: 3e-9, responseFwhm: 200e-12 } as const;
const decay = (options: Omit<SyntheticDecayOptions, keyof typeof TCSPC> & Partial<SyntheticDecayOptions>) =>
  syntheticDecay({ ...TCSPC, ...options });

describe('fitDecay: recovery from synthetic decays', () => {
  it('one exponential of 4.0 ns by reconvolution: within 1 %, and the SE covers the truth in 88-99 % of 50 seeds', () => {
    let covered = 0;
    let worst = 0;
    for (let seed = 1; seed <= 50; seed++) {
      const { counts, response } = decay({ components: [{ lifetime: 4e-9, fraction: 1 }], seed });
      const fit = fitDecay({ counts, channelWidth: TCSPC.channelWidth, response }, { components: 1 });
      const { value, standardError } = fit.components[0]!.lifetime;
      worst = Math.max(worst, Math.abs(value / 4e-9 - 1));
      if (Math.abs(value - 4e-9) <= 1.96 * standardError) covered++;
    }
    expect(worst).toBeLessThan(0.01);
    // issue 17: the 95 % interval from the inverse Fisher information covers the truth 88-99 % of the time
    expect(covered / 50).toBeGreaterThanOrEqual(0.88);
    expect(covered / 50).toBeLessThanOrEqual(0.99);
  });

  it('60 % of 2.0 ns and 40 % of 6.5 ns (amplitude fractions): both lifetimes within 3 %', () => {
    const { counts, response } = decay({
      components: [
        { lifetime: 2e-9, fraction: 0.6 },
        { lifetime: 6.5e-9, fraction: 0.4 },
      ],
      seed: 17,
    });
    const fit = fitDecay({ counts, channelWidth: TCSPC.channelWidth, response }, { components: 2 });
    const [short, long] = fit.components;
    expectClose(short!.lifetime.value, 2e-9, 0.03);
    expectClose(long!.lifetime.value, 6.5e-9, 0.03);
    expect(Math.abs(short!.fractionalAmplitude.value - 0.6)).toBeLessThan(0.03);
    // amplitude-weighted mean 3.8 ns, intensity-weighted 5.079 ns (Lakowicz 3rd ed. ch. 4, hand calculation)
    expectClose(fit.amplitudeWeightedLifetime.value, 3.8e-9, 0.03);
    expectClose(fit.intensityWeightedLifetime.value, (19.3 / 3.8) * 1e-9, 0.03);
    expect(fit.flags).toEqual([]);
  });

  it('a microsecond emitter by multichannel scaling, tail fit: Ru(bpy)3 2+ in MeCN, 930 ns, within 0.5 %', () => {
    // 930 ns: de Groot et al., J. Am. Chem. Soc. 2023, Table 3 (check-values.md section 5, "tau confirmed (primary)").
    // Invented MCS set-up: 1,024 channels of 10 ns, a 40 ns lamp pulse at 200 ns; fitted from channel 40 (400 ns) on.
    const { counts } = syntheticDecay({
      channels: 1024,
      channelWidth: 10e-9,
      responseCentre: 200e-9,
      responseFwhm: 40e-9,
      components: [{ lifetime: 930e-9, fraction: 1 }],
      seed: 3,
    });
    const fit = fitDecay({ counts, channelWidth: 10e-9 }, { components: 1, method: 'tail', startChannel: 40 });
    expectClose(fit.components[0]!.lifetime.value, 930e-9, 0.005);
    expect(fit.method).toBe('tail');
    expect(fit.shift).toBeNull();
  });

  describe('published lifetime standards as check values (Boens et al., Anal. Chem. 2007, 79, 2137)', () => {
    // The abstract gives the range of the standards at 20 °C, 89 ps to 31.2 ns (confirmed); which dye
    // holds each end (erythrosin B in water, N-(3-sulfopropyl)acridinium in water) and rhodamine B in
    // water at 1.74 ns are from memory, unverified.
    it('erythrosin B in water, 89 ps: a fast-detector set-up (12.2 ps channels, 60 ps response) within 3 %', () => {
      const { counts, response } = syntheticDecay({
        channels: 1024,
        channelWidth: 12.2e-12,
        responseCentre: 1e-9,
        responseFwhm: 60e-12,
        components: [{ lifetime: 89e-12, fraction: 1 }],
        seed: 89,
      });
      const fit = fitDecay({ counts, channelWidth: 12.2e-12, response }, { components: 1 });
      expectClose(fit.components[0]!.lifetime.value, 89e-12, 0.03);
    });

    it('rhodamine B in water, 1.74 ns, within 1 %', () => {
      const { counts, response } = decay({ components: [{ lifetime: 1.74e-9, fraction: 1 }], seed: 174 });
      const fit = fitDecay({ counts, channelWidth: TCSPC.channelWidth, response }, { components: 1 });
      expectClose(fit.components[0]!.lifetime.value, 1.74e-9, 0.01);
    });

    it('N-(3-sulfopropyl)acridinium in water, 31.2 ns, on a 4,096-channel 205 ns range, within 1 %', () => {
      const { counts, response } = syntheticDecay({
        channels: 4096,
        channelWidth: 50e-12,
        responseCentre: 5e-9,
        responseFwhm: 200e-12,
        components: [{ lifetime: 31.2e-9, fraction: 1 }],
        seed: 312,
      });
      const fit = fitDecay({ counts, channelWidth: 50e-12, response }, { components: 1 });
      expectClose(fit.components[0]!.lifetime.value, 31.2e-9, 0.01);
    });
  });
});

describe('prepareResponse: isolated spikes in the response background', () => {
  // A response measured with a few counts of dark background and five lone spikes (a cosmic or
  // electronic count each) far from the pulse: the spikes belong to no pulse and must not enter
  // the reconvolution (O'Connor & Phillips 1984, ch. 6; common practice).
  const SPIKES = [20, 300, 520, 777, 990];
  const spiked = (response: number[], seed: number, background: number, height: number) => {
    const dark = seededPoisson(seed + 101);
    const out = response.map((count) => count + dark(background));
    for (const channel of SPIKES) out[channel]! += height;
    return out;
  };

  it('zeroes every channel outside the run that holds the pulse', () => {
    const { response } = decay({ components: [{ lifetime: 4e-9, fraction: 1 }], seed: 5 });
    const prepared = prepareResponse(spiked(response, 5, 2, 200));
    for (const channel of SPIKES) expect(prepared.response[channel]).toBe(0);
    // the pulse itself is untouched: its centre channel (3 ns / 50 ps) stays the maximum
    expect(prepared.peakChannel).toBe(60);
    expect(prepared.response.reduce((sum, value) => sum + value, 0)).toBeCloseTo(1, 12);
  });

  it('a 4.0 ns decay fitted with a spiked response: reduced chi-squared near 1 and tau within 1 %, over 5 seeds', () => {
    for (const [background, height] of [
      [0, 30],
      [2, 200],
    ] as const) {
      for (let seed = 1; seed <= 5; seed++) {
        const { counts, response } = decay({ components: [{ lifetime: 4e-9, fraction: 1 }], seed });
        const fit = fitDecay(
          { counts, channelWidth: TCSPC.channelWidth, response: spiked(response, seed, background, height) },
          { components: 1 },
        );
        // reduced chi-squared of a right model has SD sqrt(2/nu), about 0.045 at ~1,000 degrees of
        // freedom (common practice): 0.85-1.15 is over 3 SD; with the spikes kept it was 1.4 to 8
        expect(fit.reducedChiSquared).toBeGreaterThan(0.85);
        expect(fit.reducedChiSquared).toBeLessThan(1.15);
        expectClose(fit.components[0]!.lifetime.value, 4e-9, 0.01);
      }
    }
  });
});

describe('fitDecay: weighted least squares against ml-levenberg-marquardt', () => {
  // The generic reference fits the same model with its own numerical derivatives and damping. Its
  // `weights` option enters the error and the normal equations differently (v5.1.0 source), so
  // the weighting 1/max(c, 1) is put into the data instead: y_i/s_i against m_i/s_i unweighted.
  function referenceFit(counts: number[], response: number[], components: 1 | 2, start: number[]) {
    const n = counts.length;
    const setup = {
      method: 'reconvolution' as const,
      components,
      channels: n,
      response: prepareResponse(response).response,
      origin: 0,
      end: n - 1,
    };
    const workspace = decayWorkspace(n);
    const sigma = counts.map((c) => Math.sqrt(Math.max(c, 1)));
    const model = new Float64Array(n);
    // parameters relative to the start, so one damping suits all: lifetimes (channels), amplitudes, background, shift
    const scale = start.map((value) => (Math.abs(value) > 0.1 ? Math.abs(value) : 1));
    const toEngine = (p: number[]) => p.map((v, k) => (k < components ? Math.log(v * scale[k]!) : v * scale[k]!));
    const result = levenbergMarquardt(
      { x: Array.from({ length: n }, (_, i) => i), y: counts.map((c, i) => c / sigma[i]!) },
      (p: number[]) => {
        evaluateDecayModel(setup, toEngine(p), model, null, workspace);
        const scaled = Float64Array.from(model, (m, i) => m / sigma[i]!);
        return (i: number) => scaled[i]!;
      },
      {
        initialValues: start.map((v, k) => v / scale[k]!),
        damping: 1e-2,
        gradientDifference: 1e-6,
        // from these starts it settles within about 25 iterations (to 1e-9 of our optimum)
        maxIterations: 60,
        errorTolerance: 1e-10,
      },
    );
    return toEngine(result.parameterValues);
  }

  it('one and two exponentials: lifetimes, amplitudes and background agree to 0.1 %', () => {
    for (const [components, parts, start] of [
      // starts are round numbers near the truth, in channels and counts: tau, a, background, shift
      [1, [{ lifetime: 4e-9, fraction: 1 }], [60, 8000, 1, 0]],
      [
        2,
        [
          { lifetime: 2e-9, fraction: 0.6 },
          { lifetime: 6.5e-9, fraction: 0.4 },
        ],
        [30, 150, 5000, 5000, 1, 0],
      ],
    ] as const) {
      const { counts, response } = decay({ components: [...parts], seed: 40 + components });
      const ours = fitDecay(
        { counts, channelWidth: TCSPC.channelWidth, response },
        { components, estimator: 'least-squares' },
      );
      const reference = referenceFit(counts, response, components, [...start]);
      const order = (theta: number[]) =>
        components === 2 && theta[0]! > theta[1]!
          ? [theta[1]!, theta[0]!, theta[3]!, theta[2]!, ...theta.slice(4)]
          : theta;
      const [a, b] = [order(ours.parameters), order(reference)];
      for (let k = 0; k < 2 * components + 1; k++) {
        const value = k < components ? Math.exp(a[k]!) : a[k]!;
        const other = k < components ? Math.exp(b[k]!) : b[k]!;
        expectClose(value, other, 1e-3);
      }
    }
  });
});
