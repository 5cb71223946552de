import type { ConcentrationUnit } from '@shared/units/units';

/** The one number formatter (shared/format), re-exported for the study screens. */
export { formatNumber } from '@shared/format';

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
