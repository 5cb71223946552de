import { describe, expect, it } from 'vitest';
import type { StudyPoint } from '../../../shared/schemas/study-points';
import {
  emptyRow,
  pasteInto,
  rowsFromPoints,
  savedPointOf,
} from '../../../src/features/studies/components/points-grid-model';

// Invented points; the corrected values are stand-ins (what the server would send), not computed here.
const saved = (id: string, position: number, concentration: number, intensity: number): StudyPoint => ({
  id,
  position,
  concentration,
  intensity,
  lifetime: null,
  absorbanceExcitation: null,
  absorbanceEmission: null,
  volumeAdded: 2e-5,
  uncertainty: null,
  excluded: false,
  exclusionReason: null,
  series: 1,
  uploadId: null,
  lifetimeUncertainty: null,
  lifetimeSource: null,
  corrected: {
    concentration: concentration * 0.99,
    intensity: intensity * 1.01,
    innerFilterFactor: null,
    dilutionFactor: 1.01,
  },
});
const points = [
  saved('a0000000-0000-4000-8000-000000000001', 0, 0, 1000),
  saved('a0000000-0000-4000-8000-000000000002', 1, 1e-3, 667),
];
const byId = new Map(points.map((point) => [point.id, point]));

describe('corrected values beside the points grid', () => {
  it('when rows come from saved points, then each finds its own point (also after a unit change)', () => {
    const rows = rowsFromPoints(points, 'uM');
    expect(rows.map((row) => savedPointOf(row, byId, 'uM')?.id)).toEqual(points.map((point) => point.id));
  });

  it("when a row above is pasted over with other values, then no row shows another row's corrected values", () => {
    const rows = [...rowsFromPoints(points, 'mM'), emptyRow()];
    // paste two new rows starting at the first: row 1 now holds 0.5 mM, row 2 holds 1 mM but 700, row 3 is new
    const pasted = pasteInto(rows, '0.5\t800\n1\t700\n2\t500', 0, 0);
    expect(pasted.map((row) => savedPointOf(row, byId, 'mM'))).toEqual([null, null, null]);
  });

  it('when a saved row is changed back to its saved values, then its corrected values show again', () => {
    const [first] = rowsFromPoints(points, 'mM');
    expect(savedPointOf({ ...first!, intensity: '999' }, byId, 'mM')).toBeNull();
    expect(savedPointOf({ ...first!, intensity: '1000' }, byId, 'mM')?.id).toBe(points[0]!.id);
    expect(savedPointOf({ ...first!, excluded: true }, byId, 'mM')).toBeNull();
  });
});
