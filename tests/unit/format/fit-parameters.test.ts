import { describe, expect, it } from 'vitest';
import { fitParameterLines } from '@shared/format';
import type { Estimate, FitResult } from '@shared/schemas/study-fits';

// The numbers are placeholders (invented, for labelling only): what is checked is which
// parameters are listed under which name, not arithmetic.
const estimate = (value: number): Estimate => ({
  value,
  standardError: value / 10,
  interval95: { lower: value * 0.8, upper: value * 1.2 },
});
const resultWith = (
  parameters: Record<string, Estimate>,
  lifetime = false,
): Pick<FitResult, 'parameters' | 'lifetime'> => ({
  parameters,
  lifetime: lifetime
    ? {
        kSv: estimate(150),
        rSquared: 0.99,
        verdict: null,
        points: [],
        xAxis: { label: '[Q] (mM)', unit: 'mM', scale: 1000 },
      }
    : null,
});

describe('fitParameterLines', () => {
  it('when the combined fit could tell the roots apart with lifetimes, then K_D and K_S are listed and the rule is named', () => {
    const { lines, note } = fitParameterLines(
      'static-dynamic',
      resultWith(
        {
          sum: estimate(450),
          product: estimate(45000),
          largerRoot: estimate(300),
          smallerRoot: estimate(150),
          kD: estimate(150),
          kS: estimate(300),
        },
        true,
      ),
    );
    expect(lines.map((line) => line.label)).toEqual(['K_D (dynamic)', 'K_S (static)', 'K_D + K_S', 'K_D × K_S']);
    expect(lines[0]!.estimate.value).toBe(150);
    expect(lines[1]!.estimate.value).toBe(300);
    expect(lines.filter((line) => line.headline).map((line) => line.key)).toEqual(['kD', 'kS']);
    expect(note).toMatch(/lifetime/);
  });

  it('when the combined fit cannot tell the roots apart, then sum, product and both roots are listed, unassigned', () => {
    const { lines, note } = fitParameterLines(
      'static-dynamic',
      resultWith({
        sum: estimate(450),
        product: estimate(45000),
        largerRoot: estimate(300),
        smallerRoot: estimate(150),
      }),
    );
    expect(lines.map((line) => line.label)).toEqual([
      'K_D + K_S',
      'K_D × K_S',
      'Larger root (K_D or K_S)',
      'Smaller root (K_D or K_S)',
    ]);
    expect(lines.map((line) => line.unit)).toEqual(['M⁻¹', 'M⁻²', 'M⁻¹', 'M⁻¹']);
    expect(lines.filter((line) => line.headline).map((line) => line.key)).toEqual(['sum', 'product']);
    expect(note).toMatch(/cannot tell/);
  });

  it('when the modified plot was fitted, then K of the accessible part and f_a are listed', () => {
    const { lines } = fitParameterLines(
      'modified',
      resultWith({ kSv: estimate(900), accessibleFraction: estimate(0.65), kq: estimate(1e9) }),
    );
    expect(lines.map((line) => [line.key, line.label, line.unit])).toEqual([
      ['kSv', 'K (accessible part)', 'M⁻¹'],
      ['accessibleFraction', 'f_a (accessible fraction)', ''],
      ['kq', 'kq', 'M⁻¹ s⁻¹'],
    ]);
  });

  it('when a straight line was fitted, then K_SV, the intercept and kq are listed', () => {
    const { lines, note } = fitParameterLines(
      'linear-free',
      resultWith({ kSv: estimate(500), intercept: estimate(1.01), kq: estimate(5e8) }),
    );
    expect(lines.map((line) => line.label)).toEqual(['K_SV', 'Intercept', 'kq']);
    expect(note).toBeNull();
  });
});
