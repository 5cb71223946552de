import { expect } from 'vitest';
import { approxEqual, relativeDifference } from '@shared/engine';

/** Fails with both numbers and their relative difference unless approxEqual holds. */
export function expectClose(actual: number, expected: number, relativeTolerance: number): void {
  if (!approxEqual(actual, expected, relativeTolerance)) {
    expect.fail(
      `expected ${actual} to equal ${expected} within ${relativeTolerance} relative ` +
        `(relative difference ${relativeDifference(actual, expected).toExponential(2)})`,
    );
  }
}
