import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { libraryKeys } from './library-keys';

export type MeasurementSegment = 'potentials' | 'lifetimes' | 'energies';

/** DELETE /api/labs/:labId/compounds/:compoundId/{potentials|lifetimes|energies}/:id (reviewers and admins). */
export const deleteMeasurement = (
  labId: string,
  compoundId: string,
  segment: MeasurementSegment,
  id: string,
  version: number,
) => apiClient.delete<void>(`/api/labs/${labId}/compounds/${compoundId}/${segment}/${id}?version=${version}`);

export function useDeleteMeasurement(labId: string, compoundId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ segment, id, version }: { segment: MeasurementSegment; id: string; version: number }) =>
      deleteMeasurement(labId, compoundId, segment, id, version),
    onSettled: () => queryClient.invalidateQueries({ queryKey: libraryKeys.lab(labId) }),
  });
}
