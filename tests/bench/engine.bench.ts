/**
 * Engine benchmark: `npm run bench:engine`. Prints, for this machine, the cost of a full
 * Stern–Volmer result (K_SV, errors, t intervals, R^2, residuals, curvature diagnosis,
 * runs test, flags) against a bare slope-and-intercept from ml-regression-simple-linear
 * on the same data, in the same run. Figures only; nothing here is asserted.
 */
import { SimpleLinearRegression } from 'ml-regression-simple-linear';
import { fitSternVolmer } from '../../shared/engine/index';

function seeded(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = Math.imul(state ^ (state >>> 15), state | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function makeSeries(count: number, points: number, seed: number): { x: number[]; y: number[] }[] {
  const random = seeded(seed);
  return Array.from({ length: count }, () => {
    const kSv = 50 + 500 * random();
    const x = Array.from({ length: points }, (_, i) => (i * 1e-2) / points);
    const y = x.map((q) => (1 + kSv * q) * (1 + 0.01 * (random() - 0.5)));
    return { x, y };
  });
}

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

let sink = 0;
const small = makeSeries(10_000, 12, 1);
const fullSmall = () => {
  for (const { x, y } of small) sink += fitSternVolmer({ concentrations: x, ratios: y }).kSv.value;
};
const bareSmall = () => {
  for (const { x, y } of small) sink += new SimpleLinearRegression(x, y).slope;
};
const [large] = makeSeries(1, 100_000, 2);
const fullLarge = () => {
  sink += fitSternVolmer({ concentrations: large!.x, ratios: large!.y }).kSv.value;
};
const bareLarge = () => {
  sink += new SimpleLinearRegression(large!.x, large!.y).slope;
};

for (let warm = 0; warm < 3; warm++) [fullSmall, bareSmall, fullLarge, bareLarge].forEach((run) => run());

const fullSmallMs = time(fullSmall, 9);
const bareSmallMs = time(bareSmall, 9);
const fullLargeMs = time(fullLarge, 9);
const bareLargeMs = time(bareLarge, 9);

const perSecond = (ms: number) => Math.round(10_000 / (ms / 1000)).toLocaleString('en-US');
console.log(`Halflight engine benchmark (Node ${process.version}, ${process.platform}/${process.arch})`);
console.log('10,000 series x 12 points');
console.log(
  `  full result (fitSternVolmer):          ${fullSmallMs.toFixed(1)} ms  = ${perSecond(fullSmallMs)} fits/s`,
);
console.log(
  `  bare line (ml-regression-simple-linear): ${bareSmallMs.toFixed(1)} ms  = ${perSecond(bareSmallMs)} fits/s`,
);
console.log(`  ratio full / bare: ${(fullSmallMs / bareSmallMs).toFixed(2)}x`);
console.log('1 series x 100,000 points');
console.log(`  full result: ${fullLargeMs.toFixed(2)} ms`);
console.log(`  bare line:   ${bareLargeMs.toFixed(2)} ms`);
console.log(`  ratio full / bare: ${(fullLargeMs / bareLargeMs).toFixed(2)}x`);
if (!Number.isFinite(sink)) throw new Error('benchmark produced a non-finite result');
