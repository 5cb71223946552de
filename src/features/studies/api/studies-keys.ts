import type { ListStudiesQuery } from '@shared/schemas/studies';

export const studiesKeys = {
  all: ['studies'] as const,
  lists: (labId: string) => [...studiesKeys.all, 'list', labId] as const,
  list: (labId: string, filters: Partial<ListStudiesQuery>) => [...studiesKeys.lists(labId), filters] as const,
  detail: (labId: string, studyId: string) => [...studiesKeys.all, 'detail', labId, studyId] as const,
  history: (labId: string, studyId: string) => [...studiesKeys.all, 'history', labId, studyId] as const,
  fits: (labId: string, studyId: string) => [...studiesKeys.all, 'fits', labId, studyId] as const,
  formOptions: (labId: string) => [...studiesKeys.all, 'form-options', labId] as const,
};
