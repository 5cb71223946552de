export const decaysKeys = {
  all: ['decays'] as const,
  studySets: (labId: string, studyId: string) => [...decaysKeys.all, 'study-sets', labId, studyId] as const,
  curves: (labId: string, setId: string, index: number) => [...decaysKeys.all, 'curves', labId, setId, index] as const,
};
