/**
 * Decay-fit benchmark: `npm run bench:decays`. Prints, for this machine, the median time of
 * 20 fits of a 4,096-channel bi-exponential decay by reconvolution with the engine (Poisson
 * maximum likelihood, analytic derivatives, recursive convolution, start values included)
 * and the time ml-levenberg-marquardt takes to reach the same optimum on the same model and
 * data by weighted least squares with its own numerical derivatives, in the same run, with
 * their ratio, then the median fit time at 4,096 channels for one to three exponentials, by
 * reconvolution and as a tail fit. Figures only; nothing here is asserted. The machine's load is printed beside
 * them: on a shared machine both figures grow together, the ratio less so.
 */
import os from 'node:os';
import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { decayWorkspace, evaluateDecayModel, fitDecay, prepareResponse } from '../../shared/engine/index';
import { syntheticDecay } from '../unit/engine/support/synthetic-decay';

const CHANNELS = 4096;
const WIDTH = 25e-12;
const { counts, response } = syntheticDecay({
  channels: CHANNELS,
  channelWidth: WIDTH,
  responseCentre: 4e-9,
  responseFwhm: 150e-12,
  components: [
    { lifetime: 2e-9, fraction: 0.6 },
    { lifetime: 6.5e-9, fraction: 0.4 },
  ],
  seed: 2026,
});

/** Median of `repeats` timings of `run`, in ms. */
function time(run: () => void, repeats: number): number {
  const timings: number[] = [];
  for (let r = 0; r < repeats; r++) {
    const start = performance.now();
    run();
    timings.push(performance.now() - start);
  }
  return timings.sort((a, b) => a - b)[Math.floor(repeats / 2)]!;
}

const ours = () => fitDecay({ counts, channelWidth: WIDTH, response }, { components: 2 });

// The generic fit: same model function, weights 1/max(c, 1) folded into the data, parameters
// scaled by round start values (lifetimes in channels, amplitudes, background, shift).
const setup = {
  method: 'reconvolution' as const,
  components: 2,
  channels: CHANNELS,
  response: prepareResponse(response).response,
  origin: 0,
  end: CHANNELS - 1,
};
const workspace = decayWorkspace(CHANNELS);
const sigma = counts.map((c) => Math.sqrt(Math.max(c, 1)));
const model = new Float64Array(CHANNELS);
const start = [60, 200, 5000, 5000, 1, 0];
const scale = start.map((value) => (Math.abs(value) > 0.1 ? Math.abs(value) : 1));
const toEngine = (p: number[]) => p.map((v, k) => (k < 2 ? Math.log(v * scale[k]!) : v * scale[k]!));
const data = { x: Array.from({ length: CHANNELS }, (_, i) => i), y: counts.map((c, i) => c / sigma[i]!) };
const generic = (iterations: number) =>
  toEngine(
    levenbergMarquardt(
      data,
      (p: number[]) => {
        evaluateDecayModel(setup, toEngine(p), model, null, workspace);
        const scaled = Float64Array.from(model, (m, i) => m / sigma[i]!);
        return (i: number) => scaled[i]!;
      },
      {
        initialValues: start.map((v, k) => v / scale[k]!),
        damping: 1e-2,
        gradientDifference: 1e-6,
        maxIterations: iterations,
        errorTolerance: 1e-10,
      },
    ).parameterValues,
  );

const lifetimesOf = (theta: number[]) => [Math.exp(theta[0]!), Math.exp(theta[1]!)].sort((a, b) => a - b);
const reference = fitDecay({ counts, channelWidth: WIDTH, response }, { components: 2, estimator: 'least-squares' });
const agrees = (theta: number[]) =>
  lifetimesOf(theta).every((tau, k) => Math.abs(tau / lifetimesOf(reference.parameters)[k]! - 1) < 1e-6);
// ml-levenberg-marquardt has no convergence test of its own (it stops at an absolute error or at
// maxIterations): give it the fewest iterations that reach our least-squares optimum to 1e-6.
let iterations = 5;
while (!agrees(generic(iterations)) && iterations < 400) iterations += 5;

for (let warm = 0; warm < 3; warm++) {
  ours();
  generic(iterations);
}
const oursMs = time(ours, 20);
const genericMs = time(() => generic(iterations), 5);
const fit = ours();

const [load1, load5] = os.loadavg();
console.log(`Decay fit, ${CHANNELS} channels of ${WIDTH * 1e12} ps, two exponentials by reconvolution`);
console.log(
  `  machine: ${os.cpus().length} cores, load average ${load1!.toFixed(1)} (1 min), ${load5!.toFixed(1)} (5 min)`,
);
console.log(
  `  Halflight engine (Poisson likelihood, analytic derivatives): ${oursMs.toFixed(1)} ms median of 20` +
    ` — ${fit.iterations} iterations, lifetimes ${fit.components.map((c) => (c.lifetime.value * 1e9).toFixed(3)).join(' and ')} ns`,
);
console.log(
  `  ml-levenberg-marquardt (weighted least squares, numerical derivatives): ${genericMs.toFixed(1)} ms median of 5` +
    ` — ${iterations} iterations to reach the same optimum within 1e-6`,
);
console.log(`  ratio generic / engine: ${(genericMs / oursMs).toFixed(1)}`);

// Typical sizes: 4,096 channels, one to three exponentials, by reconvolution and as a tail fit
// (median of 5 after a warm-up; the tail fit starts where the engine chooses).
const mixtures = [
  [{ lifetime: 3e-9, fraction: 1 }],
  [
    { lifetime: 2e-9, fraction: 0.6 },
    { lifetime: 6.5e-9, fraction: 0.4 },
  ],
  [
    { lifetime: 0.8e-9, fraction: 0.3 },
    { lifetime: 3e-9, fraction: 0.4 },
    { lifetime: 9e-9, fraction: 0.3 },
  ],
];
console.log(`Typical sizes, ${CHANNELS} channels, median of 5 (ms):`);
for (const components of mixtures) {
  const decay = syntheticDecay({
    channels: CHANNELS,
    channelWidth: WIDTH,
    responseCentre: 4e-9,
    responseFwhm: 150e-12,
    components,
    seed: 2027 + components.length,
  });
  const row: string[] = [];
  for (const method of ['reconvolution', 'tail'] as const) {
    const run = () =>
      fitDecay(
        { counts: decay.counts, channelWidth: WIDTH, response: decay.response },
        { components: components.length as 1 | 2 | 3, method },
      );
    try {
      run();
      row.push(`${method} ${time(run, 5).toFixed(1)}`);
    } catch (error) {
      row.push(`${method} not fitted (${(error as Error).message})`);
    }
  }
  console.log(`  ${components.length} exponential${components.length === 1 ? '' : 's'}: ${row.join(', ')}`);
}
