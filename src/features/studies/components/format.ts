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
/** The fit models in words (one list in shared/schemas/studies.ts, also used by the PDF report). */
export { fitModelNames as modelLabels } from '@shared/schemas/studies';
