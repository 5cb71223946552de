import type { ConcentrationUnit } from '@shared/units/units';

const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻',
  '0': '⁰',
  '1': '¹',
  '2': '²',
  '3': '³',
  '4': '⁴',
  '5': '⁵',
  '6': '⁶',
  '7': '⁷',
  '8': '⁸',
  '9': '⁹',
};

/** 5.0e8 -> "5.00 × 10⁸"; numbers between 0.01 and 10 000 stay plain. */
export function formatNumber(value: number | null | undefined, digits = 3): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const magnitude = Math.abs(value);
  if (magnitude === 0 || (magnitude >= 0.01 && magnitude < 10000)) return Number(value.toPrecision(digits)).toString();
  const [mantissa, exponent] = value.toExponential(digits - 1).split('e');
  return `${mantissa} × 10${exponent!
    .replace('+', '')
    .split('')
    .map((char) => SUPERSCRIPT[char] ?? char)
    .join('')}`;
}

/** Concentration units the grid and the spectrum editor offer (factors in @shared/units/units). */
export const gridConcentrationUnits = ['M', 'mM', 'uM'] as const satisfies readonly ConcentrationUnit[];
export type GridConcentrationUnit = (typeof gridConcentrationUnits)[number];

export const statusLabels = {
  draft: 'Draft',
  submitted: 'Awaiting review',
  approved: 'Approved',
  returned: 'Returned',
} as const;
export const modelLabels = {
  'linear-free': 'Straight line, free intercept',
  'linear-fixed': 'Straight line through 1',
  'static-dynamic': 'Static + dynamic (quadratic)',
  modified: 'Accessible fraction (modified plot)',
} as const;
