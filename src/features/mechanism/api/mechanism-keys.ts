export const mechanismKeys = {
  all: (labId: string) => ['labs', labId, 'mechanism'] as const,
  seriesList: (labId: string) => [...mechanismKeys.all(labId), 'temperature-series'] as const,
  seriesAnalysis: (labId: string, studyIds: string[]) =>
    [...mechanismKeys.all(labId), 'temperature-series', 'analysis', studyIds.join(',')] as const,
  spectrumMatrices: (labId: string, studyId: string) =>
    [...mechanismKeys.all(labId), 'spectrum-matrices', studyId] as const,
  absorptionTitrations: (labId: string, studyId: string) =>
    [...mechanismKeys.all(labId), 'absorption-titrations', studyId] as const,
  /** every answer of the study's evidence; `fitId` keys one answer to the fit it read */
  evidenceOf: (labId: string, studyId: string) => [...mechanismKeys.all(labId), 'evidence', studyId] as const,
  evidence: (labId: string, studyId: string, fitId: string | null) =>
    [...mechanismKeys.evidenceOf(labId, studyId), fitId ?? 'no fit'] as const,
};
