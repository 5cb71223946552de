import { seededRandom } from '../../../../server/lib/seeded-random';

/**
 * Small seeded generators for synthetic test data: mulberry32 (one home, in server/lib, also
 * used by the demo data) and Box–Muller normal deviates. Same seed, same numbers, every run.
 */
export { seededRandom };

export function seededNormal(seed: number): () => number {
  const uniform = seededRandom(seed);
  return () => {
    const u1 = Math.max(uniform(), 1e-12);
    const u2 = uniform();
    return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
  };
}
