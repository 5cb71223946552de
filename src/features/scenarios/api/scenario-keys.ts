export const scenarioKeys = {
  all: (labId: string) => ['labs', labId, 'scenarios'] as const,
  list: (labId: string, page: number) => [...scenarioKeys.all(labId), 'list', page] as const,
  detail: (labId: string, scenarioId: string) => [...scenarioKeys.all(labId), 'detail', scenarioId] as const,
};
