export const comparisonKeys = {
  all: (labId: string) => ['labs', labId, 'comparisons'] as const,
  detail: (labId: string, side: string, compoundId: string, approvedOnly: boolean, sort: string) =>
    [...comparisonKeys.all(labId), side, compoundId, { approvedOnly, sort }] as const,
};
