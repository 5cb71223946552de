export const mechanismKeys = {
  all: (labId: string) => ['labs', labId, 'mechanism'] as const,
  seriesList: (labId: string) => [...mechanismKeys.all(labId), 'temperature-series'] as const,
  seriesAnalysis: (labId: string, studyIds: string[]) =>
    [...mechanismKeys.all(labId), 'temperature-series', 'analysis', studyIds.join(',')] as const,
  spectrumMatrices: (labId: string, studyId: string) =>
    [...mechanismKeys.all(labId), 'spectrum-matrices', studyId] as const,
};
