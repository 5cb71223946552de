import { EngineError } from './engine-error';

/*
 * Input guards shared by the engine's public functions. Each throws an EngineError
 * naming the field, so no NaN ever leaves the engine.
 */

export function requireFinite(value: number, field: string): number {
  if (!Number.isFinite(value)) {
    throw new EngineError('NON_FINITE_VALUE', field, `expected a finite number, got ${String(value)}`);
  }
  return value;
}

export function requirePositive(value: number, field: string, advice?: string): number {
  requireFinite(value, field);
  if (value <= 0) {
    throw new EngineError('NON_POSITIVE_VALUE', field, `must be greater than zero, got ${value}`, advice);
  }
  return value;
}

export function requireNonNegative(value: number, field: string, advice?: string): number {
  requireFinite(value, field);
  if (value < 0) throw new EngineError('NEGATIVE_VALUE', field, `must not be negative, got ${value}`, advice);
  return value;
}

/** Checks every entry; names the first bad one by its index (names are built only on failure). */
// In the loops below i < values.length, so values[i]! is an element, never a hole.
export function requireFiniteArray(values: ArrayLike<number>, field: string): void {
  for (let i = 0; i < values.length; i++) if (!Number.isFinite(values[i])) requireFinite(values[i]!, `${field}[${i}]`);
}

export function requirePositiveArray(values: ArrayLike<number>, field: string, advice?: string): void {
  for (let i = 0; i < values.length; i++) {
    const value = values[i]!;
    if (!(value > 0) || value === Infinity) requirePositive(value, `${field}[${i}]`, advice);
  }
}

export function requireNonNegativeArray(values: ArrayLike<number>, field: string, advice?: string): void {
  for (let i = 0; i < values.length; i++) {
    const value = values[i]!;
    if (!(value >= 0) || value === Infinity) requireNonNegative(value, `${field}[${i}]`, advice);
  }
}

export function requireSameLength(a: ArrayLike<number>, b: ArrayLike<number>, fieldA: string, fieldB: string): void {
  if (a.length !== b.length) {
    throw new EngineError(
      'LENGTH_MISMATCH',
      fieldB,
      `has ${b.length} values but ${fieldA} has ${a.length}`,
      'Give one value per point',
    );
  }
}

/**
 * Number of distinct values, treating values within 1e-9 relative of each other as the
 * same (concentrations recomputed after dilution may differ in the last bits).
 */
export function countDistinct(values: ArrayLike<number>): number {
  let ordered = true;
  // 1 <= i < length in both loops, so i and i - 1 are indices of elements.
  for (let i = 1; i < values.length && ordered; i++) ordered = values[i]! >= values[i - 1]!;
  const sorted = ordered ? values : Array.from(values).sort((a, b) => a - b);
  let distinct = sorted.length > 0 ? 1 : 0;
  for (let i = 1; i < sorted.length; i++) {
    const previous = sorted[i - 1]!;
    const current = sorted[i]!;
    if (current - previous > 1e-9 * Math.max(Math.abs(current), Math.abs(previous))) distinct++;
  }
  return distinct;
}

/**
 * The checks every least-squares fit makes of its data: y (and the weights, when given) have one
 * entry per x, x and y are finite, and each weight is greater than zero.
 */
export function requireFitData(x: ArrayLike<number>, y: ArrayLike<number>, weights?: ArrayLike<number>): void {
  requireSameLength(x, y, 'x', 'y');
  requireFiniteArray(x, 'x');
  requireFiniteArray(y, 'y');
  if (weights) {
    requireSameLength(x, weights, 'x', 'weights');
    requirePositiveArray(weights, 'weights');
  }
}
