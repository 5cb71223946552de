export const decaysKeys = {
  all: ['decays'] as const,
  studySets: (labId: string, studyId: string) => [...decaysKeys.all, 'study-sets', labId, studyId] as const,
  compoundSets: (labId: string, compoundId: string) => [...decaysKeys.all, 'compound-sets', labId, compoundId] as const,
  setCurves: (labId: string, setId: string) => [...decaysKeys.all, 'curves', labId, setId] as const,
  curves: (labId: string, setId: string, index: number) => [...decaysKeys.setCurves(labId, setId), index] as const,
};
