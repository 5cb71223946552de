import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ImportReport, LibraryImportInput } from '@shared/schemas/library-import';
import { apiClient } from '@/lib/api-client';
import { libraryKeys } from './library-keys';

/** POST /api/labs/:labId/compounds/import. A dry run reports; a real import is all or nothing (400 lists the rows). */
export const importLibrary = (labId: string, input: LibraryImportInput) =>
  apiClient.post<ImportReport>(`/api/labs/${labId}/compounds/import`, input);

export function useImportLibrary(labId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: LibraryImportInput) => importLibrary(labId, input),
    onSuccess: (report) => report.saved && queryClient.invalidateQueries({ queryKey: libraryKeys.lab(labId) }),
  });
}

/** Where the browser downloads the whole library as CSV. */
export const libraryExportUrl = (labId: string) => `/api/labs/${labId}/compounds/export.csv`;
